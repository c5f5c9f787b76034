import type {
  ColumnAdditionTrace,
  ColumnSubtractionTrace,
  LongDivisionTrace,
  LongMultiplicationTrace,
  RoundingTrace,
} from '@workback/core';

import { rightAligned, type PaperCell, type PaperLayout, type PaperRow } from './paper';

/** Whole-number columns, ones first. */
export const PLACE_NAMES = [
  'ones',
  'tens',
  'hundreds',
  'thousands',
  'ten thousands',
  'hundred thousands',
  'millions',
  'ten millions',
  'hundred millions',
];

/** `placeIndex('hundreds')` → `2`; a place that is not a column (`'sign'`) → `null`. */
export function placeIndex(place: string | null | undefined): number | null {
  if (!place) return null;
  const index = PLACE_NAMES.indexOf(place);
  return index === -1 ? null : index;
}

/** How to lay a working out: `answer` draws only the problem and the child's answer. */
export type LayoutOptions = { differsPlace?: string | null; answer?: string };

const column = (width: number, place: string | null | undefined): number | null => {
  const index = placeIndex(place);
  return index === null || index >= width ? null : width - 1 - index;
};

const maxLength = (...texts: readonly string[]) => Math.max(...texts.map((t) => t.length));

function withOperator(cells: (PaperCell | null)[], operator: string): (PaperCell | null)[] {
  const next = cells.slice();
  next[0] = { text: operator, quiet: true };
  return next;
}

/** Column addition: carries small above, the addends, the line, the sum. */
export function layoutAddition(
  trace: ColumnAdditionTrace,
  { differsPlace, answer }: LayoutOptions = {},
): PaperLayout {
  const result = answer ?? trace.result;
  const content = Math.max(
    maxLength(result, ...trace.rows.map((r) => r.digits + '0'.repeat(r.shift))),
    trace.columns.length,
  );
  const width = content + 1;
  const rows: PaperRow[] = [];
  const carries = trace.columns.filter((c) => c.carryIn > 0);
  if (answer === undefined && carries.length > 0) {
    const cells: (PaperCell | null)[] = Array.from({ length: width }, () => null);
    for (const c of carries) cells[width - 1 - c.index] = { text: String(c.carryIn), small: true };
    rows.push({ cells, small: true });
  }
  trace.rows.forEach((row, i) => {
    const cells = rightAligned(row.digits, width, width - 1 - row.shift);
    const last = i === trace.rows.length - 1;
    rows.push({ cells: last ? withOperator(cells, '+') : cells, ruleBelow: last });
  });
  rows.push({ cells: rightAligned(result, width) });
  return { width, rows, differsAt: column(width, differsPlace) };
}

/** Column subtraction: each regrouping written small above, the digits it replaced crossed out. */
export function layoutSubtraction(
  trace: ColumnSubtractionTrace,
  { differsPlace, answer }: LayoutOptions = {},
): PaperLayout {
  const result = answer ?? trace.result;
  const content = Math.max(maxLength(result), trace.columns.length);
  const width = content + 1;
  const at = (index: number) => width - 1 - index;
  const rows: PaperRow[] = [];
  const deepest = answer === undefined ? Math.max(...trace.columns.map((c) => c.marks.length)) : 1;
  for (let level = deepest - 1; level >= 1; level -= 1) {
    const cells: (PaperCell | null)[] = Array.from({ length: width }, () => null);
    for (const c of trace.columns) {
      const mark = c.marks[level];
      if (mark === undefined) continue;
      cells[at(c.index)] = { text: String(mark), small: true, struck: level < c.marks.length - 1 };
    }
    rows.push({ cells, small: true });
  }
  const top: (PaperCell | null)[] = Array.from({ length: width }, () => null);
  const bottom: (PaperCell | null)[] = Array.from({ length: width }, () => null);
  for (const c of trace.columns) {
    if (c.top !== null) {
      top[at(c.index)] = {
        text: String(c.top),
        struck: answer === undefined && c.marks.length > 1,
      };
    }
    if (c.bottom !== null) bottom[at(c.index)] = { text: String(c.bottom) };
  }
  rows.push({ cells: top });
  rows.push({ cells: withOperator(bottom, '−'), ruleBelow: true });
  rows.push({ cells: rightAligned(result, width) });
  return { width, rows, differsAt: column(width, differsPlace) };
}

/** Long multiplication: carries above, one row per partial product (placeholder zeros quiet), their sum. */
export function layoutMultiplication(
  trace: LongMultiplicationTrace,
  { differsPlace, answer }: LayoutOptions = {},
): PaperLayout {
  const appended = trace.zeros?.appended ?? 0;
  const partialTexts = trace.partials.map((p) => p.digits + '0'.repeat(p.shift));
  const result = answer ?? trace.result;
  const content = Math.max(
    maxLength(trace.top, `${trace.bottom}0`, result, ...partialTexts),
    trace.sum?.columns.length ?? 0,
  );
  const width = content + 1;
  const rows: PaperRow[] = [];
  if (answer === undefined) {
    for (const partial of [...trace.partials].reverse()) {
      const carried = partial.cells.filter((c) => c.carryIn > 0);
      if (carried.length === 0) continue;
      const cells: (PaperCell | null)[] = Array.from({ length: width }, () => null);
      for (const c of carried)
        cells[width - 1 - c.index] = { text: String(c.carryIn), small: true };
      rows.push({ cells, small: true });
    }
  }
  rows.push({ cells: rightAligned(trace.top, width) });
  rows.push({ cells: withOperator(rightAligned(trace.bottom, width), '×'), ruleBelow: true });
  if (answer !== undefined) {
    rows.push({ cells: rightAligned(answer, width) });
    return { width, rows, differsAt: column(width, differsPlace) };
  }
  const single = trace.partials.length === 1 && trace.sum === null;
  trace.partials.forEach((partial, i) => {
    const zeros = single ? appended : partial.shift;
    const cells = rightAligned(partial.digits, width, width - 1 - zeros);
    for (let z = 0; z < zeros; z += 1) cells[width - 1 - z] = { text: '0', quiet: true };
    const last = i === trace.partials.length - 1;
    rows.push({
      cells: last && trace.partials.length > 1 ? withOperator(cells, '+') : cells,
      ruleBelow: last && !single,
    });
  });
  if (!single) {
    const sum = trace.sum?.result ?? trace.partials[0]?.value ?? '';
    const cells = rightAligned(sum, width, width - 1 - appended);
    for (let z = 0; z < appended; z += 1) cells[width - 1 - z] = { text: '0', quiet: true };
    rows.push({ cells });
  }
  return { width, rows, differsAt: column(width, differsPlace) };
}

/** Long division: the quotient over the bracket, then each multiply–subtract–bring-down step. */
export function layoutDivision(
  trace: LongDivisionTrace,
  { differsPlace, answer }: LayoutOptions = {},
): PaperLayout {
  const start = trace.divisor.length + 1;
  const width = start + trace.dividend.length;
  const rows: PaperRow[] = [];
  const quotient: (PaperCell | null)[] = Array.from({ length: width }, () => null);
  if (answer !== undefined) {
    const written = answer.split(/\s*R\s*/i)[0]?.trim() ?? answer;
    rightAligned(written, width).forEach((cell, i) => {
      if (cell && i >= start) quotient[i] = cell;
    });
  } else {
    for (const step of trace.steps) {
      if (step.quotientDigit !== null) {
        quotient[start + step.position] = { text: String(step.quotientDigit) };
      }
    }
  }
  rows.push({ cells: quotient });
  const dividend: (PaperCell | null)[] = [
    ...[...trace.divisor].map((d) => ({ text: d })),
    { text: ')', quiet: true, mark: 'bracket' as const },
    ...[...trace.dividend].map((d) => ({ text: d, mark: 'bracket' as const })),
  ];
  rows.push({ cells: dividend });
  if (answer === undefined) {
    trace.steps.forEach((step, i) => {
      const end = start + step.position;
      const product = String(step.product);
      const cells = rightAligned(product, width, end, { ruled: true });
      const minus = end - product.length;
      if (minus >= 0) cells[minus] = { text: '−', quiet: true };
      rows.push({ cells });
      const last = i === trace.steps.length - 1;
      const showDifference = step.difference !== 0 || step.broughtDown === null;
      const difference = showDifference
        ? rightAligned(String(step.difference), width, end)
        : Array.from({ length: width }, (): PaperCell | null => null);
      if (step.broughtDown !== null && end + 1 < width) {
        difference[end + 1] = { text: String(step.broughtDown) };
      }
      rows.push({ cells: difference, differs: last && differsPlace === 'remainder' });
    });
  }
  let differsAt: number | null = null;
  const quotientPlace = differsPlace?.match(/^(.+) of the quotient$/)?.[1];
  if (quotientPlace) {
    const step = trace.steps.find((s) => s.quotientPlace === quotientPlace);
    if (step) differsAt = start + step.position;
  }
  return { width, rows, differsAt };
}

/** Rounding: the place marked above, the deciding digit underlined, any in-between values, the result. */
export function layoutRounding(
  trace: RoundingTrace,
  { differsPlace, answer }: LayoutOptions = {},
): PaperLayout {
  const result = answer ?? trace.result;
  // The last step of a step-by-step rounding is the result itself.
  const between = trace.steps.filter((s, i) => !(i === trace.steps.length - 1 && s === result));
  const width = Math.max(maxLength(trace.value, result, ...between), trace.exponent + 1);
  const placeAt = width - 1 - trace.exponent;
  const rows: PaperRow[] = [];
  const marker: (PaperCell | null)[] = Array.from({ length: width }, () => null);
  marker[placeAt] = { text: '▾', small: true, quiet: true };
  rows.push({ cells: marker, small: true });
  const value = rightAligned(trace.value, width);
  const place = value[placeAt];
  if (place) value[placeAt] = { ...place, mark: 'place' };
  const decider = value[placeAt + 1];
  if (decider) value[placeAt + 1] = { ...decider, mark: 'decider' };
  rows.push({ cells: value, ruleBelow: answer !== undefined || between.length === 0 });
  if (answer === undefined) {
    between.forEach((step, i) => {
      rows.push({
        cells: rightAligned(step, width, width - 1, { quiet: true }),
        ruleBelow: i === between.length - 1,
      });
    });
  }
  rows.push({ cells: rightAligned(result, width) });
  return { width, rows, differsAt: column(width, differsPlace) };
}
