import { addColumns } from '../addition/addColumns.js';
import { divideLong } from '../division/divideLong.js';
import { layoutOf } from '../multiplication/diagnoseMultiplication.js';
import { multiplyLong } from '../multiplication/multiplyLong.js';
import { compareWhole } from '../numbers/digits.js';
import type { Operation, Problem } from '../parse/types.js';
import { subtractColumns } from '../subtraction/subtractColumns.js';
import type { MissingNumberTrace, WorkingTrace } from '../trace/types.js';

type MissingProblem = Extract<Problem, { kind: 'missing' }>;

const OPPOSITE: Readonly<Record<Operation, Operation>> = { '+': '−', '−': '+', '×': '÷', '÷': '×' };

/** The correct working of `a op b` with the written methods, or null when it has no whole answer. */
function work(
  op: Operation,
  a: string,
  b: string,
): { result: string; working: WorkingTrace } | null {
  switch (op) {
    case '+': {
      const run = addColumns([a, b]);
      return { result: run.result, working: run.trace };
    }
    case '−': {
      if (compareWhole(a, b) < 0) return null;
      const run = subtractColumns(a, b);
      return run === null ? null : { result: run.result, working: run.trace };
    }
    case '×': {
      const { top, bottom } = layoutOf([a, b]);
      const run = multiplyLong(top, bottom);
      return { result: run.result, working: run.trace };
    }
    case '÷': {
      if (b === '0' || a.length > 15 || b.length > 15) return null;
      const run = divideLong(a, b);
      if (run === null || run.remainder !== '0') return null;
      return { result: run.quotient, working: run.trace };
    }
  }
}

/**
 * Finds a missing number by the inverse operation (`? + 38 = 91` → 91 − 38), or — with
 * `habit: 'wrong-operation'` — by the operation that does not undo the equation
 * (91 + 38), as the `missing.used-wrong-operation` rule does. Null when that gives no
 * whole number.
 * `solveMissing(parse('90 - ? = 35'))?.result` → `'55'`;
 * `solveMissing(parse('90 - ? = 35'), 'wrong-operation')?.result` → `'125'`.
 */
export function solveMissing(
  problem: MissingProblem,
  habit: 'inverse' | 'wrong-operation' = 'inverse',
): MissingNumberTrace | null {
  const { op, a, b, result } = problem;
  // The inverse computation for each form: a + ? = c → c − a; ? − b = c → c + b; a − ? = c → a − c; …
  let inverse: { op: Operation; a: string; b: string };
  if (a === null) inverse = { op: OPPOSITE[op], a: result, b: b as string };
  else if (op === '+' || op === '×') inverse = { op: OPPOSITE[op], a: result, b: a };
  else inverse = { op, a, b: result };
  if (habit === 'wrong-operation') inverse = { ...inverse, op: OPPOSITE[inverse.op] };
  const worked = work(inverse.op, inverse.a, inverse.b);
  if (worked === null) return null;
  const filled = `${a ?? worked.result} ${op} ${b ?? worked.result} = ${result}`;
  return {
    kind: 'missing-number',
    equation: problem.text,
    inverse: { ...inverse, result: worked.result },
    check: filled,
    working: worked.working,
    result: worked.result,
  };
}
