const segmenter = new Intl.Segmenter('en', { granularity: 'grapheme' });

/** Longest piece of typed text a message quotes, in characters as a reader counts them. */
const MAX_QUOTED = 32;

/**
 * Quotes a piece of what was typed for a message: whole characters as a reader sees them
 * (an emoji or an accented letter is never cut in two), shortened with “…” past 32.
 * `quoteInput('rem')` → `'“rem”'`; `quoteInput('1'.repeat(100))` → `'“11111111111111111111111111111111…”'`.
 */
export function quoteInput(text: string): string {
  const parts: string[] = [];
  for (const { segment } of segmenter.segment(text)) {
    if (parts.length === MAX_QUOTED) return `“${parts.join('')}…”`;
    parts.push(segment);
  }
  return `“${parts.join('')}”`;
}
