import type { Answer, Operation, Problem } from '../parse/types.js';
import { residueOf } from './residueOf.js';
import type { CheckResult, ResidueWorking } from './types.js';

const CAVEAT: Readonly<Record<9 | 11, string>> = {
  9: 'Passing does not prove the answer right: two digits swapped (68 for 86), a 0 left out or added, and other slips that change the answer by a multiple of 9 still pass casting out nines.',
  11: 'Passing does not prove the answer right: slips that change the answer by a multiple of 11 still pass the elevens check.',
};

const reduce = (value: number, m: number): number => ((value % m) + m) % m;

const withReduction = (expression: string, value: number, m: number): string => {
  const r = reduce(value, m);
  return r === value
    ? `${expression} = ${value}`
    : `${expression} = ${value < 0 ? `−${-value}` : value} → ${r}`;
};

/**
 * Casting out nines (`modulus` 9) or elevens (11) for + − × ÷ with remainder, and for a
 * missing-number equation with the answer filled in.
 * `checkByResidues(parse('347 + 589'), whole('936'), 9).passes` → `true`.
 */
export function checkByResidues(problem: Problem, answer: Answer, modulus: 9 | 11): CheckResult {
  const method = modulus === 9 ? 'nines' : 'elevens';
  const notApplicable = (reason: string): CheckResult => ({
    applies: false,
    method,
    passes: null,
    reason,
  });
  const r = (n: string): ResidueWorking => residueOf(n, modulus);
  const warnings: string[] = [];
  let numbers: ResidueWorking[];
  let problemSide: { working: string; residue: number };
  let answerSide: { working: string; residue: number };

  if (problem.kind === 'rounding')
    return notApplicable(
      'Digit checks are for +, −, × and ÷; a rounded number is checked by its place and deciding digit instead.',
    );
  if (problem.kind === 'fraction-sum' || problem.kind === 'fraction-comparison')
    return notApplicable('Digit checks work on whole numbers, not on fractions.');
  if (problem.kind === 'decimal' || problem.kind === 'decimal-comparison')
    return notApplicable(
      'Digit checks here are for whole numbers; check a decimal answer by estimating (4.5 + 2.25 is about 7).',
    );
  if (problem.kind === 'clock')
    return notApplicable(
      'Digit checks do not work on hours and minutes; count on the clock instead.',
    );

  if (problem.kind === 'division') {
    let q: string;
    let rem: string;
    if (answer.kind === 'whole') {
      q = answer.value;
      rem = '0';
    } else if (answer.kind === 'remainder') {
      q = answer.quotient;
      rem = answer.remainder;
    } else return notApplicable('Digit checks need a whole-number answer or q R r.');
    const [rd, rq, rb, rr] = [r(problem.dividend), r(q), r(problem.divisor), r(rem)];
    numbers = [rd, rq, rb, rr];
    problemSide = { working: `${problem.dividend} → ${rd.residue}`, residue: rd.residue };
    answerSide = {
      working: withReduction(
        `${rq.residue} × ${rb.residue} + ${rr.residue}`,
        rq.residue * rb.residue + rr.residue,
        modulus,
      ),
      residue: reduce(rq.residue * rb.residue + rr.residue, modulus),
    };
    if (BigInt(rem) >= BigInt(problem.divisor)) {
      warnings.push(
        `The remainder ${rem} is not smaller than the divisor ${problem.divisor}, so the division can go further; the digit checks cannot see this, so check the remainder against the divisor.`,
      );
    }
  } else {
    if (answer.kind !== 'whole') return notApplicable('Digit checks need a whole-number answer.');
    const written = answer.value;
    if (problem.kind === 'missing') {
      const a = problem.a ?? written;
      const b = problem.b ?? written;
      const [ra, rb, rc] = [r(a), r(b), r(problem.result)];
      numbers = [ra, rb, rc];
      const combined = combine(problem.op, ra.residue, rb.residue);
      if (problem.op === '÷') {
        // a ÷ b = c is checked as a = c × b.
        const right = rc.residue * rb.residue;
        problemSide = { working: `${a} → ${ra.residue}`, residue: ra.residue };
        answerSide = {
          working: withReduction(`${rc.residue} × ${rb.residue}`, right, modulus),
          residue: reduce(right, modulus),
        };
      } else {
        problemSide = {
          working: withReduction(`${ra.residue} ${problem.op} ${rb.residue}`, combined, modulus),
          residue: reduce(combined, modulus),
        };
        answerSide = { working: `${problem.result} → ${rc.residue}`, residue: rc.residue };
      }
    } else {
      const operands =
        problem.kind === 'addition'
          ? problem.addends
          : problem.kind === 'subtraction'
            ? [problem.minuend, problem.subtrahend]
            : problem.factors;
      const op = problem.kind === 'addition' ? '+' : problem.kind === 'subtraction' ? '−' : '×';
      const ro = operands.map(r);
      const ra = r(written);
      numbers = [...ro, ra];
      let value = (ro[0] as ResidueWorking).residue;
      for (const x of ro.slice(1))
        value = op === '+' ? value + x.residue : op === '−' ? value - x.residue : value * x.residue;
      problemSide = {
        working: withReduction(ro.map((x) => x.residue).join(` ${op} `), value, modulus),
        residue: reduce(value, modulus),
      };
      answerSide = { working: `${written} → ${ra.residue}`, residue: ra.residue };
    }
  }
  const passes = problemSide.residue === answerSide.residue;
  const name = modulus === 9 ? 'Casting out nines' : 'The elevens check';
  const verdict = passes
    ? `${name} passes: both sides leave ${problemSide.residue}. That makes the answer likely, not certain.`
    : `${name} fails: the problem leaves ${problemSide.residue} but the answer leaves ${answerSide.residue}, so the answer cannot be right.`;
  return {
    applies: true,
    method,
    passes,
    numbers,
    problemSide,
    answerSide,
    verdict,
    caveat: CAVEAT[modulus],
    warnings,
  };
}

/** Residues combined by + − ×; ÷ is checked by the caller as a multiplication. */
function combine(op: Operation, a: number, b: number): number {
  if (op === '+') return a + b;
  if (op === '−') return a - b;
  return a * b;
}
