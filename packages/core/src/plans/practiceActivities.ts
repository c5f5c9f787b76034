import type { PracticeActivity } from './types.js';

/**
 * Workback's short list of generic practice activities for basic facts, in our own words.
 * `PRACTICE_ACTIVITIES['skip-counting'].title` → `'Skip-count and stop'`.
 */
export const PRACTICE_ACTIVITIES: Readonly<Record<PracticeActivity['id'], PracticeActivity>> = {
  'flash-cards': {
    id: 'flash-cards',
    title: 'Two-pile flash cards',
    how: 'Write each fact on a card with the answer on the back. A fact answered quickly and right goes on the “got it” pile; the others go back into the deck for one more round. Five minutes is plenty; stop while it is still fun.',
  },
  'timer-game': {
    id: 'timer-game',
    title: 'Beat the kitchen timer',
    how: 'Set a timer for two minutes. Take turns with whoever is at the table: one calls out a fact from the family, the next answers. Count the answers the table got together and try to beat that count next time; the score belongs to everyone, not to one child.',
  },
  'skip-counting': {
    id: 'skip-counting',
    title: 'Skip-count and stop',
    how: 'Count up the table out loud together (7, 14, 21, …), clapping on each number. Then stop on a number and ask which fact it is: 42 is 6 × 7. Next time, start the count somewhere in the middle.',
  },
  'through-ten': {
    id: 'through-ten',
    title: 'Hop through ten',
    how: 'Work the fact in two hops with ten as the stepping stone: 8 + 6 is 8 + 2, then 10 + 4. Show the hops with two rows of ten counters, then say the fact without them.',
  },
};
