import type { PracticeActivity } from './types.js';

/**
 * Workback's short list of generic practice activities for basic facts, in our own words.
 * The `how` here is the general version; `activitiesFor` writes it for one family's own
 * numbers. `PRACTICE_ACTIVITIES['skip-counting'].title` → `'Skip-count and stop'`.
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
    how: 'Count up the table out loud together, clapping on each number. Then stop on a number and ask which fact it is. Next time, start the count somewhere in the middle.',
  },
  'through-ten': {
    id: 'through-ten',
    title: 'Hop through ten',
    how: 'Work the fact in two hops with ten as the stepping stone. Show the hops with two rows of ten counters, then say the fact without them.',
  },
  'draw-rows': {
    id: 'draw-rows',
    title: 'Rows of dots',
    how: 'Draw the fact as rows of dots, count them by rows, then turn the paper sideways: the same dots show the turnaround fact.',
  },
  'near-doubles': {
    id: 'near-doubles',
    title: 'Doubles and one more',
    how: 'Start from a double the child knows, then add or take one.',
  },
};
