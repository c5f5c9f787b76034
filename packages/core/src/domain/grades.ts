/** Grade levels Workback is made for (roughly grades 1–6, with K and 7–8 at the edges). */
export const GRADE_LEVELS: readonly string[] = ['K', '1', '2', '3', '4', '5', '6', '7', '8'];

/** `isGradeLevel('3')` → `true`; `isGradeLevel('12')` → `false`. */
export function isGradeLevel(value: unknown): value is string {
  return typeof value === 'string' && GRADE_LEVELS.includes(value);
}
