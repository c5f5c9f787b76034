import type { WorkingTrace } from '@workback/core';

import { FractionComparisonDrawing, FractionSumDrawing } from './fractions';
import {
  layoutAddition,
  layoutDivision,
  layoutMultiplication,
  layoutRounding,
  layoutSubtraction,
} from './layouts';
import { Paper } from './paper';

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
  const options = { differsPlace, answer };
  switch (trace.kind) {
    case 'column-addition':
      return <Paper layout={layoutAddition(trace, options)} label={label} />;
    case 'column-subtraction':
      return <Paper layout={layoutSubtraction(trace, options)} label={label} />;
    case 'long-multiplication':
      return (
        <>
          <Paper layout={layoutMultiplication(trace, options)} label={label} />
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
  }
}
