import { readRevisit } from './readRevisit.js';

/**
 * The lesson numbers named by already-normalised entries, none when they do not read:
 * `['12', '31-33']` → `[12, 31, 32, 33]`.
 */
export function revisitLessons(entries: readonly string[]): number[] {
  const read = readRevisit(entries);
  return read.ok ? read.lessons : [];
}
