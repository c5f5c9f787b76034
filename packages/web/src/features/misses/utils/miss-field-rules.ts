import { today } from '../types';

/**
 * The checks a miss's own fields get wherever a parent types them: the log form, the edit
 * dialog and a refused draft put right. The API checks the same again and names the field.
 */
export const missFieldRules = {
  occurredOn: {
    required: 'Enter the day of the worksheet.',
    validate: (value: string) => value <= today() || 'The day cannot be in the future.',
  },
  problem: {
    required: 'Type the problem as it was written.',
    validate: (value: string) => value.trim().length > 0 || 'Type the problem as it was written.',
    maxLength: { value: 200, message: 'Keep the problem under 200 characters.' },
  },
  answer: {
    required: 'Type the answer the child wrote.',
    validate: (value: string) => value.trim().length > 0 || 'Type the answer the child wrote.',
    maxLength: { value: 80, message: 'Keep the answer under 80 characters.' },
  },
} as const;
