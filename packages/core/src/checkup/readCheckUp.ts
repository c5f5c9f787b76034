import { parseAnswer } from '../parse/parseAnswer.js';
import type { CheckUpReading, HypothesisScore } from './types.js';

/** A sheet as `planCheckUp` made it: its hypotheses and each problem's answers. */
interface Sheet {
  readonly hypotheses: readonly string[];
  readonly problems: readonly { readonly answers: Readonly<Record<string, string>> }[];
}

/**
 * Reads the child's answers to a check-up against each hypothesis. An answer that no working
 * writes is taken as a slip and speaks for none; an answer that some working writes speaks
 * against every working that writes something else. One hypothesis is confirmed when nothing
 * speaks against it, at most one answer was a slip, and every other has something against it.
 * Blank answers count for nothing.
 *
 * `readCheckUp(sheet, ['4535', '1212', '3089', '766'])` →
 * `{ verdict: 'confirmed', confirmed: 'sub.borrow-across-zero', ruledOut: ['correct', …], … }`.
 */
export function readCheckUp(
  sheet: Sheet,
  childAnswers: readonly (string | null)[],
): CheckUpReading {
  const written = sheet.problems.map((_, i) => canonical(childAnswers[i] ?? null));
  const explained = sheet.problems.map((p, i) =>
    sheet.hypotheses.some((h) => p.answers[h] === written[i]),
  );
  const slips = written.filter((w, i) => w !== null && !explained[i]).length;
  const of = sheet.problems.length;
  const scores: HypothesisScore[] = sheet.hypotheses.map((id) => {
    const fits = sheet.problems.map((p, i) => written[i] !== null && p.answers[id] === written[i]);
    return {
      id,
      matches: fits.filter(Boolean).length,
      misses: fits.filter((fit, i) => !fit && explained[i]).length,
      of,
    };
  });
  const best = scores.filter((s) => s.misses === 0);
  const confirmed =
    best.length === 1 && slips <= 1 && (best[0] as HypothesisScore).matches >= of - 1
      ? (best[0] as HypothesisScore).id
      : null;
  const against = (s: HypothesisScore): boolean =>
    s.misses >= 2 || (confirmed !== null && s.id !== confirmed);
  return {
    verdict: confirmed === null ? 'open' : 'confirmed',
    confirmed,
    ruledOut: scores.filter(against).map((s) => s.id),
    open: scores.filter((s) => !against(s)).map((s) => s.id),
    scores,
  };
}

/** The answer as Workback prints it (commas, spaces and `r` folded), or `null` when blank. */
function canonical(text: string | null): string | null {
  if (text === null || text.trim() === '') return null;
  const read = parseAnswer(text);
  return read.ok ? read.answer.text : text.trim();
}
