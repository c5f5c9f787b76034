import { diagnose } from '../diagnose/diagnose.js';
import { ruleInfo } from '../rules/catalog.js';
import { applyRule } from '../rules/applyRule.js';
import { parseProblem } from '../parse/parseProblem.js';
import { candidateProblem, type PracticeForm } from './candidateProblem.js';
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

/**
 * Fresh problems of the rule's kind on which that rule gives a wrong answer, so re-working
 * them shows whether the error is still there. Deterministic for a given seed.
 * `practiceFor('sub.borrow-across-zero', { count: 2, digits: 3, seed: 7 })` →
 * `{ ok: true, ruleId: 'sub.borrow-across-zero', problems: [{ problem: '602 − 48', answer: '554', ruleAnswer: '454' }, …] }`.
 */
export function practiceFor(
  ruleId: string,
  options: {
    readonly count?: number;
    readonly digits?: number;
    readonly seed?: number;
    /** Write a column rule's problems as decimals or money, as the child's miss was. */
    readonly form?: PracticeForm;
  } = {},
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
    const text = candidateProblem(info, random, digits, { form: options.form });
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
