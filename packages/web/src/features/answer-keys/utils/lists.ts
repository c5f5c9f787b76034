/** `'12; 31-33'` → `['12', '31-33']`; also for skills and fact families. */
export function splitList(text: string): string[] {
  return text
    .split(';')
    .map((part) => part.trim())
    .filter(Boolean);
}

/** `['12', '31-33']` → `'12; 31-33'`. */
export const joinList = (list: readonly string[]) => list.join('; ');

const SINGLE = /^\d{1,4}$/;
const RANGE = /^(\d{1,4})\s*[-–]\s*(\d{1,4})$/;

/**
 * Checks lessons to revisit as the parent types them (`12; 31-33`) and returns the first
 * problem in plain words, or `null` when they read well.
 */
export function revisitProblem(text: string): string | null {
  for (const entry of splitList(text)) {
    if (SINGLE.test(entry)) {
      if (Number(entry) < 1) return 'Lesson numbers start at 1.';
      continue;
    }
    const range = RANGE.exec(entry);
    if (!range) return `“${entry}” is not a lesson number or a range such as 31-33.`;
    const from = Number(range[1]);
    const to = Number(range[2]);
    if (from < 1) return 'Lesson numbers start at 1.';
    if (from > to) return `The range “${entry}” runs backwards: write ${to}-${from}.`;
    if (to - from >= 60) return `The range “${entry}” spans more than 60 lessons.`;
  }
  return null;
}
