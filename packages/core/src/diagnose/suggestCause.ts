import { compareWhole } from '../numbers/digits.js';
import { ruleInfo } from '../rules/catalog.js';
import { adjacentSwap } from './adjacentSwap.js';
import type { Diagnosis, SuggestedCause } from './types.js';

/**
 * Offers the likely cause for the parent to confirm: `step` when a systematic rule
 * reproduces the answer, `fact` when only basic-fact slips explain it, `slip` when a written
 * step differs by a one-off the child did right elsewhere, `copying` when the
 * answer is the right digits shifted a column or two neighbouring digits swapped (or the
 * right working on a number copied a column off); otherwise `null`. A suggestion, never a verdict.
 * `suggestCause(diagnose('81 - 38', '57'))` → `{ cause: 'step', ruleIds: ['sub.smaller-from-larger'], … }`.
 */
export function suggestCause(diagnosis: Omit<Diagnosis, 'suggestedCause'>): SuggestedCause | null {
  if (diagnosis.correct) return null;
  const top = diagnosis.rules[0];
  if (top !== undefined) {
    const systematic = top.ids.filter((id) => ruleInfo(id)?.kind === 'systematic');
    if (systematic.length > 0) {
      const titles = systematic.map((id) => ruleInfo(id)?.title.toLowerCase() ?? id).join(' and ');
      return {
        cause: 'step',
        because: `The answer is exactly what the written method gives with this step done differently (${titles}). If the child works other problems the same way, it is a method step to re-teach.`,
        ruleIds: systematic,
      };
    }
    return {
      cause: 'fact',
      because: `The method is right and one basic fact is off (${diagnosis.facts.map((f) => `${f.a} ${f.op === 'x' ? '×' : f.op === '-' ? '−' : f.op} ${f.b} taken as ${f.written}`).join(', ') || 'one fact'}). If the child catches it on a second look, it may be a slip instead.`,
      ruleIds: top.ids,
    };
  }
  const step = diagnosis.writtenSteps;
  const finding = step?.firstDiffers == null ? null : step.steps[step.firstDiffers]?.finding;
  if (finding != null && finding.oneOff) {
    const label = step?.steps[step.firstDiffers ?? 0]?.label ?? 'a written step';
    return finding.ids.some((id) => ruleInfo(id)?.kind === 'fact')
      ? {
          cause: 'fact',
          because: `The method is right; one basic fact in ${label} is off (see the written steps).`,
          ruleIds: finding.ids,
        }
      : {
          cause: 'slip',
          because: `${label.charAt(0).toUpperCase()}${label.slice(1)} differs by a one-off: the child did the same step right elsewhere (see the written steps). If they find it on a second look, it was a slip.`,
          ruleIds: [],
        };
  }
  const shifted = copyShift(diagnosis);
  if (shifted !== null) return { cause: 'copying', because: shifted, ruleIds: [] };
  return null;
}

function copyShift(d: Omit<Diagnosis, 'suggestedCause'>): string | null {
  if (d.parsedAnswer.kind !== 'whole' || !/^\d+$/.test(d.expected)) return null;
  const written = d.parsedAnswer.value;
  const expected = d.expected;
  const swap = adjacentSwap(expected, written);
  if (swap !== null) {
    return `The answer has the right digits with two neighbours swapped (${swap.written} for ${swap.expected}), which often happens when writing the answer down.`;
  }
  if (written === `${expected}0` || `${written}0` === expected) {
    return `The answer has the right digits moved one column (${written} for ${expected}), which often comes from lining up or copying.`;
  }
  const p = d.problem;
  const operands =
    p.kind === 'addition'
      ? p.addends
      : p.kind === 'subtraction'
        ? [p.minuend, p.subtrahend]
        : p.kind === 'multiplication'
          ? p.factors
          : null;
  if (operands === null) return null;
  for (let i = 0; i < operands.length; i += 1) {
    const original = operands[i] as string;
    const variants = [`${original}0`];
    if (original.endsWith('0') && original.length > 1) variants.push(original.slice(0, -1));
    for (const v of variants) {
      const copy = operands.map((o, j) => (j === i ? v : o));
      let value: bigint;
      if (p.kind === 'addition') value = copy.reduce((s, x) => s + BigInt(x), 0n);
      else if (p.kind === 'subtraction') {
        if (compareWhole(copy[0] as string, copy[1] as string) < 0) continue;
        value = BigInt(copy[0] as string) - BigInt(copy[1] as string);
      } else value = BigInt(copy[0] as string) * BigInt(copy[1] as string);
      if (value.toString() === written) {
        return `The answer is right for ${v} in place of ${original}: the number looks copied one column off.`;
      }
    }
  }
  return null;
}
