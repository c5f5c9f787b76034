export type Student = {
  id: number;
  name: string;
  gradeLevel: string;
  createdAt: string;
  updatedAt: string;
};

export type StudentInput = { name: string; gradeLevel: string };

/** `gradeLabel('K')` → `'Kindergarten'`; `gradeLabel('3')` → `'Grade 3'`. */
export function gradeLabel(gradeLevel: string): string {
  return gradeLevel === 'K' ? 'Kindergarten' : `Grade ${gradeLevel}`;
}

/** `formatAdded('2026-03-04T10:00:00Z')` → `'4 Mar 2026'` (in the reader's locale). */
export function formatAdded(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
}
