import type { WrittenStepCheck, WrittenStepsReport } from '../diagnose/types.js';
import { wrongFacts } from '../diagnose/wrongFacts.js';
import type { LongDivisionTrace } from '../trace/types.js';

const digitsWritten = (w: string): string =>
  w
    .trim()
    .replace(/,/g, '')
    .replace(/^0+(?=\d)/, '');

/**
 * Compares the numbers written under the dividend (each step's product, then its difference)
 * with the usual working's, and says what a wrong one shows on its own: a multiplication fact
 * off in the product, or a subtraction off by one or two.
 * `checkLines(divideLong('84', '4').trace, ['8', '0', '4', '1']).steps[3]`
 * → `{ label: 'step 2 difference', work: '4 − 4', expected: '0', written: '1', ok: false, finding: … }`.
 */
export function checkLines(trace: LongDivisionTrace, lines: readonly string[]): WrittenStepsReport {
  const steps: WrittenStepCheck[] = [];
  const count = Math.max(trace.steps.length * 2, lines.length);
  for (let i = 0; i < count; i += 1) {
    const s = trace.steps[Math.floor(i / 2)];
    const isProduct = i % 2 === 0;
    const label = `step ${Math.floor(i / 2) + 1} ${isProduct ? 'product' : 'difference'}`;
    const written = lines[i] === undefined ? '' : digitsWritten(lines[i] as string);
    if (s === undefined) {
      steps.push({ label, work: '', expected: '', written, ok: false, finding: null });
      continue;
    }
    const q = s.quotientDigit ?? 0;
    const expected = String(isProduct ? s.product : s.difference);
    const work = isProduct ? `${q} × ${trace.divisor}` : `${s.number} − ${s.product}`;
    const ok = written === expected;
    let finding: WrittenStepCheck['finding'] = null;
    if (!ok && written !== '') {
      const w = Number(written);
      const d = Number(trace.divisor);
      if (isProduct && d <= 9 && wrongFacts('x', q, d).includes(w)) {
        finding = {
          ids: ['mul.fact'],
          oneOff: true,
          explanation: `In ${label}, ${q} × ${d} was taken as ${w} instead of ${s.product}.`,
        };
      } else if (!isProduct && Math.abs(w - s.difference) <= 2) {
        finding = {
          ids: ['sub.fact'],
          oneOff: true,
          explanation: `In ${label}, ${s.number} − ${s.product} was worked out as ${w} instead of ${s.difference}.`,
        };
      }
    }
    steps.push({ label, work, expected, written, ok, finding });
  }
  const first = steps.findIndex((st) => !st.ok);
  return { kind: 'lines', steps, firstDiffers: first < 0 ? null : first };
}
