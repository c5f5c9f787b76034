import { diagnose } from '../diagnose/diagnose.js';
import { ruleInfo, type RuleInfo } from '../rules/catalog.js';
import { applyRule } from '../rules/applyRule.js';
import { parseProblem } from '../parse/parseProblem.js';
import { seededRandom } from './seededRandom.js';

/** One practice problem: the problem, its answer, and what the rule would write. */
export interface PracticeProblem {
  readonly problem: string;
  readonly answer: string;
  /** The answer the rule's method gives (`null` for fact rules, which have no fixed wrong answer). */
  readonly ruleAnswer: string | null;
}

export type PracticeSet =
  | { readonly ok: true; readonly ruleId: string; readonly problems: readonly PracticeProblem[] }
  | { readonly ok: false; readonly error: { readonly message: string } };

type Random = () => number;

const int = (random: Random, lo: number, hi: number): number =>
  lo + Math.floor(random() * (hi - lo + 1));

/** A number with exactly `digits` digits; zeros are made more likely so regrouping-across-zero cases turn up. */
function wholeOf(random: Random, digits: number, zeroBias = 0.25): string {
  let s = String(int(random, 1, 9));
  for (let i = 1; i < digits; i += 1) s += random() < zeroBias ? '0' : String(int(random, 0, 9));
  return s;
}

/** A candidate problem for the rule's operation, as text. */
function candidate(info: RuleInfo, random: Random, digits: number): string {
  const d = Math.max(1, digits);
  switch (info.operation) {
    case 'addition': {
      const other =
        info.id === 'add.left-aligned'
          ? int(random, 1, Math.max(1, d - 1))
          : int(random, Math.max(1, d - 1), d);
      return `${wholeOf(random, d, 0.1)} + ${wholeOf(random, other, 0.1)}`;
    }
    case 'subtraction': {
      const top = wholeOf(
        random,
        Math.max(2, d),
        info.id === 'sub.n-minus-zero-is-zero' ? 0.1 : 0.35,
      );
      const len =
        info.id === 'sub.left-aligned'
          ? int(random, 1, top.length - 1)
          : int(random, Math.max(1, top.length - 1), top.length);
      const bottom = wholeOf(random, len, info.id === 'sub.n-minus-zero-is-zero' ? 0.4 : 0.1);
      return `${top} - ${bottom}`;
    }
    case 'multiplication': {
      const two = info.id === 'mul.no-placeholder' || info.id === 'mul.partials-added-wrong';
      if (info.id === 'mul.zeros-dropped' || info.id === 'mul.zeros-extra') {
        const top = `${int(random, 1, 9)}${'0'.repeat(int(random, 1, Math.max(1, d - 1)))}`;
        return `${top} x ${int(random, 1, 9)}${'0'.repeat(int(random, 0, 2))}`;
      }
      return `${wholeOf(random, d, info.id === 'mul.zero-times-n-is-n' ? 0.4 : 0.1)} x ${two ? wholeOf(random, 2, 0.1) : String(int(random, 2, 9))}`;
    }
    case 'division': {
      const divisor = int(random, 2, 9);
      const zeroQuotient = info.id === 'div.quotient-zero-omitted';
      if (zeroQuotient) {
        // Build the quotient with a 0 in it, so a brought-down number is smaller than the divisor.
        let q = String(int(random, 1, 9));
        for (let i = 1; i < Math.max(3, d); i += 1) q += i === 1 ? '0' : String(int(random, 0, 9));
        return `${BigInt(q) * BigInt(divisor) + BigInt(int(random, 0, divisor - 1))} ÷ ${divisor}`;
      }
      return `${wholeOf(random, Math.max(2, d), 0.1)} ÷ ${divisor}`;
    }
    case 'rounding': {
      const value = wholeOf(random, Math.max(2, d), 0.15);
      const names = ['ten', 'hundred', 'thousand', 'ten thousand', 'hundred thousand', 'million'];
      const exponent = int(random, 1, Math.max(1, value.length - 1));
      return `round ${value} to the nearest ${names[exponent - 1] ?? 'ten'}`;
    }
    case 'missing': {
      const ops = ['+', '-', 'x', '÷'] as const;
      const op = ops[int(random, 0, 3)] as (typeof ops)[number];
      const a = BigInt(wholeOf(random, d, 0.1));
      const b = BigInt(op === 'x' || op === '÷' ? int(random, 2, 9) : wholeOf(random, d, 0.1));
      const blankFirst = random() < 0.5;
      if (op === '+') return blankFirst ? `? + ${b} = ${a + b}` : `${a} + ? = ${a + b}`;
      if (op === '-') return blankFirst ? `? - ${b} = ${a}` : `${a + b} - ? = ${a}`;
      if (op === 'x') return blankFirst ? `? x ${b} = ${a * b}` : `${b} x ? = ${a * b}`;
      return blankFirst ? `? ÷ ${b} = ${a}` : `${a * b} ÷ ? = ${a}`;
    }
    case 'fraction': {
      const max = d <= 1 ? 9 : 12;
      if (info.id === 'frac.larger-denominator-larger') {
        const n = int(random, 1, 3);
        return `${n}/${int(random, n + 1, max)} ? ${n}/${int(random, n + 1, max)}`;
      }
      const q = int(random, 2, max);
      const s = int(random, 2, max);
      return `${int(random, 1, q - 1)}/${q} + ${int(random, 1, s - 1)}/${s}`;
    }
  }
}

/**
 * Fresh problems of the rule's kind on which that rule gives a wrong answer, so re-working
 * them shows whether the error is still there. Deterministic for a given seed.
 * `practiceFor('sub.borrow-across-zero', { count: 2, digits: 3, seed: 7 })` →
 * `{ ok: true, ruleId: 'sub.borrow-across-zero', problems: [{ problem: '602 − 48', answer: '554', ruleAnswer: '454' }, …] }`.
 */
export function practiceFor(
  ruleId: string,
  options: { readonly count?: number; readonly digits?: number; readonly seed?: number } = {},
): PracticeSet {
  const info = ruleInfo(ruleId);
  if (info === undefined)
    return { ok: false, error: { message: `“${ruleId}” is not a rule in the catalog.` } };
  const count = Math.min(Math.max(options.count ?? 5, 1), 50);
  const digits = Math.min(Math.max(options.digits ?? 3, 1), 9);
  const random = seededRandom(options.seed ?? 1);
  const problems: PracticeProblem[] = [];
  const seen = new Set<string>();
  for (let attempt = 0; attempt < 4000 && problems.length < count; attempt += 1) {
    const text = candidate(info, random, digits);
    const parsed = parseProblem(text);
    if (!parsed.ok || seen.has(parsed.problem.text)) continue;
    const problem = parsed.problem;
    const solved = diagnose(text, '0');
    if (!solved.ok) continue;
    const answer = solved.expected;
    let ruleAnswer: string | null = null;
    if (info.kind === 'systematic' && info.id !== 'mul.partials-added-wrong') {
      const wrong = applyRule(ruleId, problem).filter((a) => a !== answer);
      if (wrong.length === 0) continue;
      ruleAnswer = wrong[0] as string;
    }
    seen.add(problem.text);
    problems.push({ problem: problem.text, answer, ruleAnswer });
  }
  if (problems.length === 0) {
    return {
      ok: false,
      error: {
        message: `Could not make ${digits}-digit problems on which ${ruleId} gives a different answer; try more digits.`,
      },
    };
  }
  return { ok: true, ruleId, problems };
}
