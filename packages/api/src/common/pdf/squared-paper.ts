import { formatTrace, type WorkingTrace } from '@workback/core';
import { HIGHLIGHT, INK, printable, type Doc } from './pdf-document.js';

/** One square of the paper, in points; digits are set in its middle. */
export const CELL = 15;
const DIGIT = 11;
const SMALL = 6.5;
/** Height of one line of small regrouping digits. */
const ABOVE = 8;
const GRID = '#dfe4ee';

/** A digit or sign in a cell, with small regrouping marks above it. */
interface Cell {
  readonly text: string;
  /** Drawn crossed out (a top digit rewritten while regrouping). */
  readonly struck?: boolean;
  /** Small values written above, in order; all but the last crossed out. */
  readonly above?: readonly string[];
  /** A decimal point written after it, on the line between this square and the next. */
  readonly point?: boolean;
}

/** Rows of cells, right-aligned, with rules under some rows; `place` names columns from the right. */
interface Sheet {
  readonly rows: readonly (readonly (Cell | null)[])[];
  /** Row indexes with a rule drawn under them. */
  readonly rules: readonly number[];
  /** Column names by index from the right (0 = ones). */
  readonly places: readonly string[];
}

const digitsOf = (s: string, struck = false): Cell[] => [...s].map((ch) => ({ text: ch, struck }));

/** A number placed right-aligned in `width` columns, `shift` columns left of the right edge. */
function row(cells: Cell[], width: number, shift = 0, sign?: string): (Cell | null)[] {
  const out: (Cell | null)[] = Array.from({ length: width }, () => null);
  cells.forEach((c, i) => {
    const at = width - shift - cells.length + i;
    if (at >= 0) out[at] = c;
  });
  if (sign) out[0] = { text: sign };
  return out;
}

/** The trace as a sheet of squared paper, or null when it is not a column layout. */
function sheetOf(trace: WorkingTrace): Sheet | null {
  const sheet = columnsOf(trace);
  const point = 'point' in trace ? (trace.point ?? 0) : 0;
  return sheet === null || point === 0 ? sheet : withPoint(sheet, point);
}

/**
 * Decimals are worked on lined-up columns with the point set aside: it goes back after the
 * ones square of every row of figures (a 0 written there when the row has no ones digit).
 */
function withPoint(sheet: Sheet, point: number): Sheet {
  return {
    ...sheet,
    rows: sheet.rows.map((cells) => {
      if (!cells.some((c) => c !== null && /\d/.test(c.text))) return cells;
      const at = cells.length - 1 - point;
      const out = cells.slice();
      const ones = out[at];
      out[at] = ones && ones.text !== '' ? { ...ones, point: true } : { text: '0', point: true };
      return out;
    }),
  };
}

function columnsOf(trace: WorkingTrace): Sheet | null {
  switch (trace.kind) {
    case 'column-addition': {
      const width =
        Math.max(trace.result.length, ...trace.rows.map((r) => r.digits.length + r.shift)) + 1;
      const carries = row([], width);
      for (const c of trace.columns) {
        const at = width - 1 - c.index;
        if (c.carryIn > 0 && at >= 0) carries[at] = { text: '', above: [String(c.carryIn)] };
      }
      const rows = trace.rows.map((r, i) =>
        row(digitsOf(r.digits), width, r.shift, i === trace.rows.length - 1 ? '+' : undefined),
      );
      // Carries go above the top row's digits, as written small on paper.
      const top = rows[0]!.map((c, i) =>
        carries[i]?.above ? { ...(c ?? { text: '' }), above: carries[i]!.above } : c,
      );
      return {
        rows: [top, ...rows.slice(1), row(digitsOf(trace.result), width)],
        rules: [rows.length - 1],
        places: trace.columns.map((c) => c.place),
      };
    }
    case 'column-subtraction': {
      const width =
        Math.max(
          trace.top.digits.length + trace.top.shift,
          trace.bottom.digits.length + trace.bottom.shift,
          trace.result.length,
        ) + 1;
      const top = row(digitsOf(trace.top.digits), width, trace.top.shift);
      for (const c of trace.columns) {
        const at = width - 1 - trace.top.shift - c.index;
        const cell = top[at];
        if (cell && c.marks.length > 1)
          top[at] = { ...cell, struck: true, above: c.marks.slice(1).map(String) };
      }
      return {
        rows: [
          top,
          row(digitsOf(trace.bottom.digits), width, trace.bottom.shift, '−'),
          row(digitsOf(trace.result), width),
        ],
        rules: [1],
        places: trace.columns.map((c) => c.place),
      };
    }
    case 'long-multiplication': {
      const partials = trace.sum === null ? [] : trace.partials.map((p) => p.value);
      const width =
        Math.max(
          trace.top.length,
          trace.bottom.length + 1,
          trace.result.length,
          ...partials.map((p) => p.length),
        ) + 1;
      return {
        rows: [
          row(digitsOf(trace.top), width),
          row(digitsOf(trace.bottom), width, 0, '×'),
          ...partials.map((p, i) =>
            row(digitsOf(p), width, 0, i === partials.length - 1 ? '+' : undefined),
          ),
          ...(partials.length > 0
            ? [row(digitsOf(trace.result), width)]
            : [row(digitsOf(trace.result), width)]),
        ],
        rules: partials.length > 0 ? [1, 1 + partials.length] : [1],
        places: [],
      };
    }
    case 'missing-number':
      return trace.working === null ? null : sheetOf(trace.working);
    default:
      return null;
  }
}

/**
 * Draws a working at (x, y) as a teacher writes it on squared paper: every digit inside its
 * own square, the sign in the left column, a rule under the numbers, regrouping as small
 * digits above the column with the old top digit crossed out (the first rewritten value
 * crossed out too when it changed twice), carries small above. The column named
 * `highlight` (a place such as `'tens'`) is shaded softly. Kinds that are not a column
 * layout are written as plain lines. Returns the height used.
 */
export function drawWorking(
  doc: Doc,
  trace: WorkingTrace,
  x: number,
  y: number,
  options: { color?: string; highlight?: string | null; width?: number } = {},
): number {
  const color = options.color ?? INK;
  const sheet = sheetOf(trace);
  const maxWidth = options.width ?? 220;
  if (sheet === null) {
    doc.font('sans').fontSize(9.5).fillColor(color);
    let used = 0;
    for (const line of formatTrace(trace)) {
      const text = printable(line);
      doc.text(text, x, y + used, { width: maxWidth });
      used += doc.heightOfString(text, { width: maxWidth }) + 1;
    }
    doc.fillColor(INK).fontSize(10.5);
    return used;
  }
  const cols = sheet.rows[0]!.length;
  const stack = Math.max(0, ...sheet.rows.flatMap((r) => r.map((c) => c?.above?.length ?? 0)));
  // Room above for the small regrouping digits, one short line per rewrite, stacked upwards.
  const top = y + (stack > 0 ? stack * ABOVE + 3 : 0);
  const height = top - y + sheet.rows.length * CELL;
  const hi = options.highlight ? sheet.places.indexOf(options.highlight) : -1;
  if (hi >= 0) {
    doc
      .save()
      .fillColor(HIGHLIGHT)
      .rect(x + (cols - 1 - hi) * CELL, y, CELL, height)
      .fill()
      .restore();
  }
  doc.save().lineWidth(0.4).strokeColor(GRID);
  for (let c = 0; c <= cols; c += 1)
    doc
      .moveTo(x + c * CELL, top)
      .lineTo(x + c * CELL, y + height)
      .stroke();
  for (let r = 0; r <= sheet.rows.length; r += 1)
    doc
      .moveTo(x, top + r * CELL)
      .lineTo(x + cols * CELL, top + r * CELL)
      .stroke();
  doc.restore();

  sheet.rows.forEach((cells, r) => {
    const cy = top + r * CELL;
    cells.forEach((cell, c) => {
      if (!cell) return;
      const cx = x + c * CELL;
      if (cell.text) {
        const w = DIGIT * 0.6;
        doc
          .font(/\d/.test(cell.text) ? 'mono' : 'sans')
          .fontSize(DIGIT)
          .fillColor(color)
          .text(cell.text, cx + (CELL - w) / 2, cy + (CELL - DIGIT) / 2 + 0.5, {
            lineBreak: false,
          });
        if (cell.point)
          doc
            .circle(cx + CELL, cy + CELL - 3, 1.2)
            .fillColor(color)
            .fill();
        if (cell.struck)
          doc
            .save()
            .lineWidth(0.9)
            .strokeColor(color)
            .moveTo(cx + 3, cy + CELL - 3)
            .lineTo(cx + CELL - 3, cy + 3)
            .stroke()
            .restore();
      }
      if (cell.above?.length) {
        // Each rewrite small above the column, the newest highest; the older ones crossed out.
        const sw = SMALL * 0.6;
        cell.above.forEach((t, j) => {
          const ay = cy - 2 - (j + 1) * ABOVE + 1;
          const ax = cx + (CELL - t.length * sw) / 2;
          doc.font('mono').fontSize(SMALL).fillColor(color).text(t, ax, ay, { lineBreak: false });
          if (j < cell.above!.length - 1)
            doc
              .save()
              .lineWidth(0.6)
              .strokeColor(color)
              .moveTo(ax - 0.5, ay + SMALL * 0.95)
              .lineTo(ax + t.length * sw + 0.5, ay + SMALL * 0.05)
              .stroke()
              .restore();
        });
      }
    });
  });
  doc.save().lineWidth(1).strokeColor(color);
  for (const r of sheet.rules)
    doc
      .moveTo(x + 2, top + (r + 1) * CELL)
      .lineTo(x + cols * CELL - 2, top + (r + 1) * CELL)
      .stroke();
  doc.restore();
  doc.font('sans').fontSize(10.5).fillColor(INK);
  return height;
}

/** The width in points a working takes when drawn by `drawWorking` (null for plain lines). */
export function workingWidth(trace: WorkingTrace): number | null {
  const sheet = sheetOf(trace);
  return sheet === null ? null : sheet.rows[0]!.length * CELL;
}
