import { diagnose } from '../diagnose/diagnose.js';
import { parseAnswer } from '../parse/parseAnswer.js';
import { parseProblem } from '../parse/parseProblem.js';
import type { Problem } from '../parse/types.js';
import { candidateProblem } from '../practice/candidateProblem.js';
import { seededRandom } from '../practice/seededRandom.js';
import { applyRule } from '../rules/applyRule.js';
import { RULES, ruleInfo, type RuleInfo } from '../rules/catalog.js';
import { rightAnswerOf } from './rightAnswerOf.js';
import {
  RIGHT_WORKING,
  type CheckUpPlan,
  type CheckUpProblem,
  type MergedCandidate,
} from './types.js';

const MIN_PROBLEMS = 4;
const MAX_PROBLEMS = 6;
/** How many times each pair of hypotheses must write different answers … */
const SEPARATIONS = 2;
/** … and how many the sheet aims for while it has room, so one slip cannot hide a difference. */
const AIM = 3;
/** Fresh problems drawn per method rule before choosing; enough for every pair in tests. */
const POOL_PER_RULE = 40;

interface Scored {
  readonly text: string;
  readonly answers: Readonly<Record<string, string>>;
  /** Zeros beyond the ones the candidates need: a worksheet seldom has many. */
  readonly zeros: number;
}

/**
 * Plans a check-up: 4–6 fresh problems at the child's level on which every pair of
 * explanations — each candidate rule, and the right working (which also stands for a one-off
 * slip) — writes different answers at least twice. Chooses greedily the problem that settles
 * the most pairs still open, then the one that splits the hypotheses most evenly (expected
 * information gain under equal odds). Pure and repeatable for a given seed.
 *
 * `planCheckUp(['sub.borrow-across-zero', 'sub.borrow-from-zero'], { digits: 4, seed: 1 })` →
 * `{ ok: true, operation: 'subtraction', hypotheses: ['correct', 'sub.borrow-across-zero',
 * 'sub.borrow-from-zero'], problems: [{ problem: '5003 − 468', answers: { correct: '4535', … } }, …] }`.
 */
export function planCheckUp(
  candidates: readonly string[],
  options: { readonly digits?: number; readonly seed?: number } = {},
): CheckUpPlan {
  const infos: RuleInfo[] = [];
  for (const id of candidates) {
    const info = ruleInfo(id);
    if (info === undefined)
      return { ok: false, error: { message: `“${id}” is not a rule in the catalog.` } };
    if (!infos.includes(info)) infos.push(info);
  }
  if (infos.length === 0)
    return { ok: false, error: { message: 'Name at least one rule to make a check-up for.' } };
  const operation = (infos[0] as RuleInfo).operation;
  const other = infos.find((i) => i.operation !== operation);
  if (other !== undefined)
    return {
      ok: false,
      error: {
        message: `A check-up covers one operation: ${(infos[0] as RuleInfo).id} is ${operation}, ${other.id} is ${other.operation}.`,
      },
    };

  const merged: MergedCandidate[] = [];
  const methods: RuleInfo[] = [];
  for (const info of RULES.filter((r) => infos.includes(r))) {
    if (info.kind === 'fact' || info.id === 'mul.partials-added-wrong')
      merged.push({
        id: info.id,
        reason:
          info.kind === 'fact'
            ? 'A one-off fact slip has no fixed wrong answer; on fresh problems it looks like the right working.'
            : 'Adding the partial products wrongly shows only in written working, not in the answers.',
      });
    else methods.push(info);
  }
  if (methods.length === 0)
    return {
      ok: false,
      error: {
        message:
          'These rules have no fixed wrong answer to tell apart; a short drill of the facts shows more.',
      },
    };

  const asked = Math.min(Math.max(options.digits ?? 3, 1), 9);
  const hypotheses = [RIGHT_WORKING, ...methods.map((m) => m.id)];
  // Some habits cannot show at the child's size (no zero to regroup across in two digits):
  // go up a digit or two rather than hand out a sheet that cannot tell them apart.
  let best: Sheet | null = null;
  for (let digits = asked; digits <= Math.min(9, asked + 2); digits += 1) {
    const sheet = chooseProblems(methods, hypotheses, digits, options.seed ?? 1);
    if (sheet !== null && (best === null || sheet.unseparated.length < best.unseparated.length))
      best = sheet;
    if (best !== null && best.unseparated.length === 0) break;
  }
  if (best === null)
    return {
      ok: false,
      error: {
        message: `Could not find ${MIN_PROBLEMS} ${asked}-digit problems for these rules; try more digits.`,
      },
    };
  return { ok: true, operation, hypotheses, ...best, merged };
}

interface Sheet {
  readonly problems: readonly CheckUpProblem[];
  readonly unseparated: readonly (readonly [string, string])[];
}

/** The greedy choice of 4–6 problems from a fresh pool; null when the pool is too thin. */
function chooseProblems(
  methods: readonly RuleInfo[],
  hypotheses: readonly string[],
  digits: number,
  seed: number,
): Sheet | null {
  const pool = drawPool(methods, hypotheses, seededRandom(seed), digits);
  const pairs: [string, string][] = [];
  hypotheses.forEach((a, i) => hypotheses.slice(i + 1).forEach((b) => pairs.push([a, b])));
  const need = new Map(pairs.map(([a, b]) => [`${a}|${b}`, AIM]));
  const chosen: Scored[] = [];
  const left = [...pool];

  while (chosen.length < MAX_PROBLEMS && left.length > 0) {
    const open = pairs.filter(([a, b]) => (need.get(`${a}|${b}`) ?? 0) > 0);
    if (open.length === 0 && chosen.length >= MIN_PROBLEMS) break;
    // Pairs short of the required two count before those short only of the aim.
    const urgent = (a: string, b: string): number =>
      (need.get(`${a}|${b}`) ?? 0) > AIM - SEPARATIONS ? 2 : 1;
    let bestAt = 0;
    let best: readonly [number, number, number] = [-1, -1, 0];
    left.forEach((p, at) => {
      const settles = open
        .filter(([a, b]) => p.answers[a] !== p.answers[b])
        .reduce((sum, [a, b]) => sum + urgent(a, b), 0);
      const score = [settles, splitEntropy(p, hypotheses), -p.zeros] as const;
      if (isBetter(score, best)) {
        best = score;
        bestAt = at;
      }
    });
    const pick = left.splice(bestAt, 1)[0] as Scored;
    if (best[0] === 0 && chosen.length >= MIN_PROBLEMS) break;
    if (!namesItsWriters(pick, hypotheses)) continue;
    chosen.push(pick);
    for (const [a, b] of pairs)
      if (pick.answers[a] !== pick.answers[b])
        need.set(`${a}|${b}`, Math.max(0, (need.get(`${a}|${b}`) ?? 0) - 1));
  }

  if (chosen.length < MIN_PROBLEMS) return null;
  return {
    problems: chosen.map((c) => ({ problem: c.text, answers: c.answers })),
    unseparated: pairs.filter(([a, b]) => (need.get(`${a}|${b}`) ?? 0) > AIM - SEPARATIONS),
  };
}

/** Fresh problems of the kinds the rules show on, each with every hypothesis's answer. */
function drawPool(
  methods: readonly RuleInfo[],
  hypotheses: readonly string[],
  random: () => number,
  digits: number,
): Scored[] {
  const seen = new Set<string>();
  const pool: Scored[] = [];
  const zerosNeeded = methods.some((m) => /zero/.test(m.id));
  for (let i = 0; i < POOL_PER_RULE * methods.length; i += 1) {
    const info = methods[i % methods.length] as RuleInfo;
    const parsed = parseProblem(candidateProblem(info, random, digits));
    if (!parsed.ok || seen.has(parsed.problem.text)) continue;
    seen.add(parsed.problem.text);
    const scored = answersOf(parsed.problem, hypotheses);
    if (scored === null) continue;
    const zeros = (parsed.problem.text.match(/0/g) ?? []).length;
    pool.push({ text: parsed.problem.text, answers: scored, zeros: zerosNeeded ? 0 : zeros });
  }
  return pool;
}

/** The answer each hypothesis writes; a rule that does not apply here writes the right answer. */
function answersOf(problem: Problem, hypotheses: readonly string[]): Record<string, string> | null {
  const right = rightAnswerOf(problem);
  if (right === null) return null;
  const answers: Record<string, string> = { [RIGHT_WORKING]: right };
  for (const id of hypotheses.slice(1)) {
    const outputs = applyRule(id, problem);
    const written = outputs.find((o) => o !== right) ?? outputs[0];
    const read = written === undefined ? null : parseAnswer(written);
    answers[id] = read?.ok === true ? read.answer.text : right;
  }
  return answers;
}

/**
 * Each wrong answer on the problem, diagnosed, must name first a hypothesis that writes it,
 * so the sheet's parent key and the notebook's diagnosis never disagree.
 */
function namesItsWriters(p: Scored, hypotheses: readonly string[]): boolean {
  const right = p.answers[RIGHT_WORKING];
  for (const id of hypotheses.slice(1)) {
    const answer = p.answers[id] as string;
    if (answer === right) continue;
    const d = diagnose(p.text, answer);
    const first = d.ok ? d.rules[0]?.id : undefined;
    if (first === undefined || p.answers[first] !== answer) return false;
  }
  return true;
}

/** Entropy, in bits, of how the problem's answers split the hypotheses. */
function splitEntropy(p: Scored, hypotheses: readonly string[]): number {
  const counts = new Map<string, number>();
  for (const h of hypotheses)
    counts.set(p.answers[h] as string, (counts.get(p.answers[h] as string) ?? 0) + 1);
  let bits = 0;
  for (const n of counts.values()) {
    const share = n / hypotheses.length;
    bits -= share * Math.log2(share);
  }
  return bits;
}

function isBetter(a: readonly number[], b: readonly number[]): boolean {
  for (let i = 0; i < a.length; i += 1) {
    if ((a[i] as number) > (b[i] as number) + 1e-9) return true;
    if ((a[i] as number) < (b[i] as number) - 1e-9) return false;
  }
  return false;
}
