const segmenter = new Intl.Segmenter('en', { granularity: 'grapheme' });

/**
 * The whole character (grapheme) that starts at, or contains, position `index` of `text`,
 * so that a message names an emoji or a letter with its accent whole.
 * `graphemeAt('7 👍🏽', 2)` → `'👍🏽'`; `graphemeAt('abc', 1)` → `'b'`.
 */
export function graphemeAt(text: string, index: number): string {
  const found = segmenter.segment(text).containing(index);
  return found === undefined ? (text[index] ?? '') : found.segment;
}
