export type Course = {
  id: number;
  name: string;
  level: string | null;
  lessonCount: number;
  createdAt: string;
  updatedAt: string;
};

export type Lesson = {
  id: number;
  courseId: number;
  number: number;
  title: string;
  skills: string[];
  createdAt: string;
  updatedAt: string;
};

export type CourseInput = { name: string; level: string | null };

export type LessonInput = { number: number; title: string; skills: string[] };

/** `'regrouping; subtraction'` → `['regrouping', 'subtraction']` (blank entries dropped). */
export function splitList(text: string): string[] {
  return text
    .split(';')
    .map((part) => part.trim())
    .filter(Boolean);
}
