import type { Problem, WorkingTrace } from '@workback/core';

import { FractionComparisonDrawing, FractionSumDrawing } from './fractions';
import {
  PLACE_NAMES,
  layoutAddition,
  layoutDivision,
  layoutMultiplication,
  layoutRounding,
  layoutSubtraction,
} from './layouts';
import { Paper, rightAligned, type PaperCell, type PaperLayout } from './paper';

type DrawingProps = {
  trace: WorkingTrace;
  label: string;
  /** Where the child's working first went differently (a column, `'remainder'`, `'sign'`…). */
  differsPlace?: string | null;
  /** Draw only the problem and this answer (no working is known for it). */
  answer?: string;
  /** Show the check line of a missing-number working (only true for the usual working). */
  showCheck?: boolean;
};

/** Kinds drawn on squared paper, where the child's bare answer can sit under the problem. */
export const PAPER_KINDS: ReadonlySet<WorkingTrace['kind']> = new Set([
  'column-addition',
  'column-subtraction',
  'long-multiplication',
  'long-division',
  'rounding',
]);

/** One working, drawn the way it is written on paper; every kind the engine produces. */
export function TraceDrawing({ trace, label, differsPlace, answer, showCheck }: DrawingProps) {
  // Decimals are worked on lined-up columns with the point set aside: name the columns as the
  // working does, and draw the point back in.
  const point = 'point' in trace ? (trace.point ?? 0) : 0;
  const options = {
    differsPlace: point > 0 ? scaledPlace(differsPlace, point) : differsPlace,
    answer: point > 0 && answer !== undefined ? answer.replace('.', '') : answer,
  };
  const paper = (layout: PaperLayout) => (
    <Paper layout={point > 0 ? withPoint(layout, point) : layout} label={label} />
  );
  switch (trace.kind) {
    case 'column-addition':
      return paper(layoutAddition(trace, options));
    case 'column-subtraction':
      return paper(layoutSubtraction(trace, options));
    case 'long-multiplication':
      return (
        <>
          {paper(layoutMultiplication(trace, options))}
          {trace.zeros && answer === undefined ? (
            <p className="wb-trace-aside">
              The zeros at the ends were set aside ({trace.zeros.top} from {trace.top},{' '}
              {trace.zeros.bottom} from {trace.bottom}), the rest multiplied, and{' '}
              {trace.zeros.appended} {trace.zeros.appended === 1 ? 'zero' : 'zeros'} put back on.
            </p>
          ) : null}
        </>
      );
    case 'long-division':
      return (
        <>
          <Paper layout={layoutDivision(trace, options)} label={label} />
          <p className="wb-trace-aside">
            Answer written: <span className="wb-mono">{answer ?? trace.result}</span>
            {answer === undefined && trace.remainder !== '0' && !/R/.test(trace.result)
              ? ` (quotient ${trace.quotient}, remainder ${trace.remainder})`
              : null}
          </p>
        </>
      );
    case 'rounding':
      return (
        <>
          <Paper layout={layoutRounding(trace, options)} label={label} />
          <p className="wb-trace-aside">
            Rounding to the nearest {trace.place.replace(/s$/, '')}.
            {answer === undefined ? ` ${trace.rule}` : null}
          </p>
        </>
      );
    case 'missing-number':
      return (
        <div className="wb-trace-missing" aria-label={label} role="group">
          <p className="wb-mono wb-trace-equation">{trace.equation}</p>
          <p className="wb-trace-aside">
            Found with{' '}
            <span className="wb-mono">
              {trace.inverse.a} {trace.inverse.op} {trace.inverse.b} = {trace.inverse.result}
            </span>
          </p>
          {trace.working ? (
            <TraceDrawing
              trace={trace.working}
              label={`${label}: the working`}
              differsPlace={differsPlace}
            />
          ) : null}
          {showCheck ? (
            <p className="wb-trace-aside">
              Check: <span className="wb-mono">{trace.check}</span>
            </p>
          ) : null}
        </div>
      );
    case 'fraction-sum':
      return <FractionSumDrawing trace={trace} differsPlace={differsPlace} label={label} />;
    case 'fraction-comparison':
      return <FractionComparisonDrawing trace={trace} differsPlace={differsPlace} label={label} />;
    case 'decimal-comparison':
      return (
        <div className="wb-trace-missing" aria-label={label} role="group">
          <p className="wb-mono wb-trace-equation">
            {trace.left} ? {trace.right}
          </p>
          <p className="wb-trace-aside">
            {trace.basis}: <span className="wb-mono">{answer ?? trace.result}</span>
          </p>
        </div>
      );
    case 'clock':
      return (
        <div className="wb-trace-missing" aria-label={label} role="group">
          <p className="wb-mono wb-trace-equation">
            {trace.left} {trace.op} {trace.right} = {answer ?? trace.result}
          </p>
          {answer === undefined ? (
            <ul className="wb-trace-aside">
              {trace.steps.map((step) => (
                <li key={step}>{step}</li>
              ))}
            </ul>
          ) : null}
        </div>
      );
  }
}

type DecimalProblem = Extract<Problem, { kind: 'decimal' }>;
type Decimal = DecimalProblem['left'];

/** A row of squares for a decimal as written, its last digit in square `end`, the point after its ones digit. */
function decimalRow(n: Decimal | string, width: number, end: number): (PaperCell | null)[] {
  const [whole = '', decimals = ''] = typeof n === 'string' ? n.split('.') : [n.whole, n.decimals];
  const cells = rightAligned(`${whole}${decimals}`, width, end);
  const ones = end - decimals.length;
  const cell = cells[ones];
  if (decimals.length > 0 && cell) cells[ones] = { ...cell, text: <>{cell.text}.</> };
  return cells;
}

/**
 * `dec.right-aligned` as the child wrote it: the numbers lined up by their last digits, so the
 * points stand in different columns, worked as whole numbers, and the child's answer under
 * them. The columns whose points should have lined up are shaded.
 */
export function RightAlignedDrawing({
  problem,
  answer,
  label,
}: {
  problem: DecimalProblem;
  answer: string;
  label: string;
}) {
  const figures = (n: Decimal) => n.whole.length + n.decimals.length;
  const written = answer.replace(/^\$/, '');
  const width =
    Math.max(figures(problem.left), figures(problem.right), written.replace('.', '').length) + 1;
  const end = width - 1;
  const bottom = decimalRow(problem.right, width, end);
  bottom[0] = { text: problem.op, quiet: true };
  const points = [problem.left, problem.right]
    .filter((n) => n.decimals.length > 0)
    .map((n) => end - n.decimals.length);
  const layout: PaperLayout = {
    width,
    rows: [
      { cells: decimalRow(problem.left, width, end) },
      { cells: bottom, ruleBelow: true },
      { cells: decimalRow(written, width, end) },
    ],
    differsAt: points.length > 1 && points[0] !== points[1] ? Math.min(...points) : null,
  };
  return (
    <>
      <Paper layout={layout} label={label} />
      <p className="wb-trace-aside">
        Lined up by the last digits: the points of{' '}
        <span className="wb-mono">{formatDecimal(problem.left)}</span> and{' '}
        <span className="wb-mono">{formatDecimal(problem.right)}</span> stand in different columns,
        so tenths are added to hundredths.
      </p>
    </>
  );
}

const formatDecimal = (n: Decimal) => (n.decimals ? `${n.whole}.${n.decimals}` : n.whole);

const DECIMAL_PLACES = ['tenths', 'hundredths', 'thousandths', 'ten-thousandths'];

/** A decimal place named as its column of the lined-up working: with 2 places, tenths → tens. */
export function scaledPlace(place: string | null | undefined, point: number): string | null {
  if (!place) return null;
  const whole = PLACE_NAMES.indexOf(place);
  const decimal = DECIMAL_PLACES.indexOf(place);
  const index = whole >= 0 ? whole + point : decimal >= 0 ? point - 1 - decimal : -1;
  return index >= 0 ? (PLACE_NAMES[index] ?? null) : place;
}

/** The point drawn after the ones digit of every row of figures (a 0 before it where none is written). */
function withPoint(layout: PaperLayout, point: number): PaperLayout {
  const at = layout.width - 1 - point;
  return {
    ...layout,
    rows: layout.rows.map((row) => {
      if (row.small || !row.cells.some((c) => c !== null && /\d/.test(String(c.text)))) return row;
      const cells = row.cells.slice();
      const ones = cells[at];
      cells[at] =
        ones === null || ones === undefined
          ? { text: '0.', quiet: true }
          : { ...ones, text: <>{ones.text}.</> };
      return { ...row, cells };
    }),
  };
}
