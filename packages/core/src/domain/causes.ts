/**
 * Why a problem was missed, as the parent decides after talking it through.
 * `Cause.step` → `'step'` (a systematic written-method error).
 */
export const Cause = {
  slip: 'slip',
  fact: 'fact',
  concept: 'concept',
  step: 'step',
  reading: 'reading',
  copying: 'copying',
  unsure: 'unsure',
} as const;
export type Cause = (typeof Cause)[keyof typeof Cause];

export const CAUSES: readonly Cause[] = Object.values(Cause);

/** Parent-facing label and one line of guidance for each cause. */
export const CAUSE_GUIDE: Readonly<Record<Cause, { label: string; hint: string }>> = {
  slip: {
    label: 'Slip',
    hint: 'On a second look the child finds and fixes it alone.',
  },
  fact: {
    label: 'Basic fact',
    hint: 'A fact such as 7 × 8 is not automatic yet; the method was right.',
  },
  concept: {
    label: 'Concept',
    hint: 'The child cannot say why the method works, or chose the wrong idea.',
  },
  step: {
    label: 'Method step',
    hint: 'The same wrong step in a written method, done the same way each time.',
  },
  reading: {
    label: 'Misread',
    hint: 'The question was read or understood differently from what it asks.',
  },
  copying: {
    label: 'Copying',
    hint: 'A number was copied wrongly or the columns did not line up.',
  },
  unsure: {
    label: 'Not sure yet',
    hint: 'Leave it open and decide after talking it through.',
  },
};

/** `isCause('fact')` → `true`. */
export function isCause(value: unknown): value is Cause {
  return typeof value === 'string' && (CAUSES as readonly string[]).includes(value);
}
