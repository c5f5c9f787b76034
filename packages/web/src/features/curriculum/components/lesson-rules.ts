import type { RegisterOptions } from 'react-hook-form';

export type LessonValues = { number: string; title: string; skills: string };

/** The same checks as the API's, so most mistakes show before anything is sent. */
export const lessonRules = {
  number: {
    validate: (value: string) =>
      (/^\d{1,4}$/.test(value.trim()) && Number(value) >= 1) || 'A lesson number from 1 to 9999.',
  },
  title: {
    validate: (value: string) => value.trim().length > 0 || 'Give the lesson a title.',
    maxLength: { value: 120, message: 'Keep it under 120 characters.' },
  },
} satisfies Record<string, RegisterOptions<LessonValues, 'number' | 'title'>>;
