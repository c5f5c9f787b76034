import { seededRandom } from '../practice/seededRandom.js';
import { RULES } from '../rules/catalog.js';
import { planCheckUp } from './planCheckUp.js';
import { readCheckUp } from './readCheckUp.js';
import type { CheckUpPlan } from './types.js';

/** How often a simulated child is named rightly after one check-up sheet. */
export interface IdentificationRate {
  readonly operation: string;
  readonly trials: number;
  readonly identified: number;
  readonly rate: number;
}

type Sheet = Extract<CheckUpPlan, { ok: true }>;

/**
 * Simulates children of one operation: each follows one hypothesis of a sheet (the right
 * working or a candidate rule), planned for one or two rules of that operation, and slips on
 * any one problem with probability `slipRate` (one digit of the answer written differently).
 * A trial counts when `readCheckUp` confirms the hypothesis the child followed. Seeded.
 * `identificationRate('subtraction', { trials: 1000 })` → `{ trials: 1000, identified: 993, rate: 0.993, … }`.
 */
export function identificationRate(
  operation: string,
  options: { readonly trials?: number; readonly slipRate?: number; readonly seed?: number } = {},
): IdentificationRate {
  const trials = options.trials ?? 1000;
  const slipRate = options.slipRate ?? 0.05;
  const random = seededRandom(options.seed ?? 1);
  const rules = RULES.filter(
    (r) =>
      r.operation === operation && r.kind === 'systematic' && r.id !== 'mul.partials-added-wrong',
  ).map((r) => r.id);
  const sheets = new Map<string, Sheet>();
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)] as T;
  let identified = 0;
  for (let trial = 0; trial < trials; trial += 1) {
    const first = pick(rules);
    const second = random() < 0.5 ? pick(rules) : first;
    const candidates = [...new Set([first, second])];
    // Ten sheets per candidate set: the children vary more than the sheets need to.
    const key = `${candidates.join('+')}#${trial % 10}`;
    let sheet = sheets.get(key);
    if (sheet === undefined) {
      const plan = planCheckUp(candidates, { digits: 2 + (trial % 3), seed: trial % 10 });
      if (!plan.ok) continue;
      sheet = plan;
      sheets.set(key, sheet);
    }
    const truth = pick(sheet.hypotheses);
    const answers = sheet.problems.map((p) => {
      const answer = p.answers[truth] as string;
      return random() < slipRate ? slipOnce(answer, random) : answer;
    });
    if (readCheckUp(sheet, answers).confirmed === truth) identified += 1;
  }
  return { operation, trials, identified, rate: identified / trials };
}

/** The answer with one digit written as another digit. */
function slipOnce(answer: string, random: () => number): string {
  const places = [...answer].flatMap((c, i) => (/\d/.test(c) ? [i] : []));
  if (places.length === 0) return answer;
  const at = places[Math.floor(random() * places.length)] as number;
  const was = Number(answer[at]);
  const now = (was + 1 + Math.floor(random() * 9)) % 10;
  return answer.slice(0, at) + String(now) + answer.slice(at + 1);
}
