import { readRevisit } from '@workback/core';

/** `'12; 31-33'` → `['12', '31-33']`; also for skills and fact families. */
export function splitList(text: string): string[] {
  return text
    .split(';')
    .map((part) => part.trim())
    .filter(Boolean);
}

/** `['12', '31-33']` → `'12; 31-33'`. */
export const joinList = (list: readonly string[]) => list.join('; ');

/**
 * Checks lessons to revisit as the parent types them (`12; 31-33`) with the API's own rule
 * (core's `readRevisit`) and returns its problem as a sentence, or `null` when they read well:
 * `revisitProblem('7-5')` → `'Range “7-5” runs backwards; write 5-7.'`.
 */
export function revisitProblem(text: string): string | null {
  const read = readRevisit(splitList(text));
  return read.ok ? null : `${read.message[0]!.toUpperCase()}${read.message.slice(1)}.`;
}
