import type { WrittenStepCheck, WrittenStepsReport } from '../diagnose/types.js';
import { wrongFacts } from '../diagnose/wrongFacts.js';
import { placeName, stripLeadingZeros } from '../numbers/digits.js';
import type { PartialProduct } from '../trace/types.js';
import { MULTIPLICATION_METHOD_RULES } from './diagnoseMultiplication.js';
import { multiplyLong, type MultiplicationMethod, type MultiplicationRun } from './multiplyLong.js';

const places = (n: number): string => (n === 1 ? 'one place' : `${n} places`);

/** A written number as digits: commas and leading zeros removed. */
export const digitsWritten = (w: string): string => stripLeadingZeros(w.trim().replace(/,/g, ''));

/**
 * Compares each written partial product with the usual one and, for one that differs, works
 * that partial product on its own (top × one digit): a rule's method, the placeholder zero
 * left out, one carry not added, or one basic fact off. A rule found there is a one-off
 * (`oneOff: true`) when another partial product, written right, needed the same step done
 * right. `firstDiffers` is the first partial product that differs.
 * `checkPartials('347', '26', multiplyLong('347', '26'), ['2082', '6840']).steps[1].finding`
 * → `{ ids: ['mul.no-carry'], oneOff: true, explanation: 'In partial product 2 (347 × 2), …' }`.
 */
export function checkPartials(
  top: string,
  bottom: string,
  correct: MultiplicationRun,
  partials: readonly string[],
): WrittenStepsReport {
  const expected = correct.trace.partials;
  const steps: WrittenStepCheck[] = [];
  for (let i = 0; i < Math.max(expected.length, partials.length); i += 1) {
    const p = expected[i];
    const w = partials[i] === undefined ? '' : digitsWritten(partials[i] as string);
    const label = `partial product ${i + 1}`;
    if (p === undefined) {
      steps.push({ label, work: '', expected: '', written: w, ok: false, finding: null });
      continue;
    }
    const ok = w === p.value;
    steps.push({
      label,
      work: `${top} × ${p.multiplierDigit}${p.shift > 0 ? `, ${places(p.shift)} left` : ''}`,
      expected: p.value,
      written: w,
      ok,
      finding: ok || w === '' ? null : onItsOwn(top, p, i, w, partials, expected),
    });
  }
  const first = steps.findIndex((s) => !s.ok);
  return { kind: 'partials', steps, firstDiffers: first < 0 ? null : first };
}

/** What reproduces one wrong partial product worked on its own, best first; null when nothing does. */
function onItsOwn(
  top: string,
  p: PartialProduct,
  index: number,
  written: string,
  partials: readonly string[],
  expected: readonly PartialProduct[],
): WrittenStepCheck['finding'] {
  const d = String(p.multiplierDigit);
  const zeros = '0'.repeat(p.shift);
  const valueOf = (run: MultiplicationRun): string => {
    const digits = (run.trace.partials[0] as PartialProduct).digits;
    return digits === '0' ? '0' : digits + zeros;
  };
  const lead = `In ${`partial product ${index + 1}`} (${top} × ${d})`;
  // A rule's habit is a one-off when a partial product written right needed the same step.
  const doneRightElsewhere = (method: MultiplicationMethod): boolean =>
    expected.some((q, k) => {
      if (k === index || partials[k] === undefined) return false;
      if (digitsWritten(partials[k] as string) !== q.value) return false;
      const run = multiplyLong(top, String(q.multiplierDigit), method);
      return run.fired.length > 0 && run.result !== q.digits;
    });
  const slipWords = (oneOff: boolean): string =>
    oneOff
      ? ' Another partial product, written right, needed the same step done right, so this looks like a one-off slip rather than a habit.'
      : '';

  // A rule's method that gives this partial product, and whether other work contradicts it.
  let ruleFinding: NonNullable<WrittenStepCheck['finding']> | null = null;
  for (const rule of MULTIPLICATION_METHOD_RULES) {
    if (rule.method.placeholder !== undefined) continue;
    const run = multiplyLong(top, d, rule.method);
    if (run.fired.length === 0 || valueOf(run) !== written) continue;
    const oneOff = doneRightElsewhere(rule.method);
    ruleFinding = {
      ids: [rule.id],
      oneOff,
      explanation: `${lead}, ${lowerFirst(rule.explain(run))}${slipWords(oneOff)}`,
    };
    break;
  }
  if (ruleFinding !== null && !ruleFinding.oneOff) return ruleFinding;
  for (const c of p.cells) {
    if (c.carryIn === 0) continue;
    const run = multiplyLong(top, d, { dropCarryAt: { partial: 0, column: c.index } });
    if (valueOf(run) !== written) continue;
    const leftmost = c.index === p.cells.length - 1;
    const wrote = leftmost ? c.product : c.product % 10;
    const right = leftmost ? c.product + c.carryIn : (c.product + c.carryIn) % 10;
    return {
      ids: ['mul.no-carry'],
      oneOff: true,
      explanation: `${lead}, the ${c.carryIn} carried into the ${placeName(c.index)} digit was not added there: ${c.topDigit} × ${d} = ${c.product}, and ${wrote} was written instead of ${right} (${c.product} + ${c.carryIn} = ${c.product + c.carryIn}). The other steps carry correctly, so this looks like a one-off slip rather than a habit.`,
    };
  }
  if (ruleFinding !== null) return ruleFinding;
  if (p.shift > 0 && p.digits === written) {
    const oneOff = expected.some(
      (q, k) =>
        k !== index &&
        q.shift > 0 &&
        partials[k] !== undefined &&
        digitsWritten(partials[k] as string) === q.value,
    );
    return {
      ids: ['mul.no-placeholder'],
      oneOff,
      explanation: `${lead}, ${p.digits} was written without moving it ${places(p.shift)} to the left (${p.value}).${slipWords(oneOff)}`,
    };
  }
  for (const c of p.cells) {
    for (const w of wrongFacts('x', c.topDigit, c.multiplierDigit)) {
      const run = multiplyLong(top, d, { slip: { partial: 0, column: c.index, product: w } });
      if (valueOf(run) !== written) continue;
      return {
        ids: ['mul.fact'],
        oneOff: true,
        explanation: `${lead}, ${c.topDigit} × ${d} was taken as ${w} instead of ${c.product}; the rest of that partial product is right.`,
      };
    }
  }
  return null;
}

const lowerFirst = (s: string): string => s.charAt(0).toLowerCase() + s.slice(1);
