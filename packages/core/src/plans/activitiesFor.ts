import { factParts } from '../patterns/factParts.js';
import { factText } from '../patterns/factText.js';
import type { BasicFact } from '../patterns/types.js';
import { PRACTICE_ACTIVITIES } from './practiceActivities.js';
import type { PracticeActivity } from './types.js';

/**
 * Every activity that suits drilling one fact family, each written for that family's own
 * numbers and wrong facts, the best fit first. The 8s count 8, 16, 24 … and stop on an
 * 8s fact; an addition family hops through ten with one of its own facts.
 * `activitiesFor('x8', [{ op: 'x', a: 7, b: 8 }])[0].how` → `'Count up the 8s out loud together (8, 16, 24, …) …'`.
 */
export function activitiesFor(family: string, facts: readonly BasicFact[]): PracticeActivity[] {
  const n = Number(family.slice(1));
  const times = family.startsWith('x');
  const own = facts.map((f) => {
    const [a, b] = factParts(f);
    // The family's number first: for the 8s, 7 × 8 is read "8 × 7".
    return { fact: f, other: a === n ? b : a, text: factText(f) };
  });
  const first = own[0];
  const list = own.map((o) => o.text).join(', ');
  // "other 8s facts", "an 8s fact"; an addition family: "other + and − facts with 8".
  const many = times ? `${n}s facts` : `+ and − facts with ${n}`;
  const one = times
    ? `${/^(8|11|18)$/.test(String(n)) ? 'an' : 'a'} ${n}s fact`
    : `a + or − fact with ${n}`;
  const out: PracticeActivity[] = [];
  const push = (id: PracticeActivity['id'], how: string) =>
    out.push({ ...PRACTICE_ACTIVITIES[id], how });

  if (times) {
    if (n >= 2 && first) {
      const count = [1, 2, 3].map((k) => k * n).join(', ');
      const product = n * first.other;
      push(
        'skip-counting',
        `Count up the ${n}s out loud together (${count}, …), clapping on each number. Then stop on a number and ask which ${n}s fact it is: ${product} is ${first.other} × ${n}. Next time, start the count somewhere in the middle of the ${n}s.`,
      );
    }
    if (first && first.other > 0 && first.other <= 10 && n > 0)
      push(
        'draw-rows',
        `Draw ${first.other} rows of ${n} dots for ${first.other} × ${n} and count them by rows (${[
          1, 2, 3,
        ]
          .filter((k) => k <= first.other)
          .map((k) => k * n)
          .join(
            ', ',
          )}, …) to ${first.other * n}. Turn the paper sideways: the same dots show ${n} × ${first.other}.`,
      );
  } else {
    const crossing = own.find((o) => {
      const [a, b] = factParts(o.fact);
      return a < 10 && b < 10 && a + b > 10;
    });
    if (crossing) {
      const [a, b] = factParts(crossing.fact);
      const big = Math.max(a, b);
      const small = Math.min(a, b);
      const hop = 10 - big;
      push(
        'through-ten',
        `Work ${big} + ${small} in two hops with ten as the stepping stone: ${big} + ${hop} makes 10, then 10 + ${small - hop} makes ${big + small}. Show the hops with two rows of ten counters, then do the other facts with ${n} the same way.`,
      );
    }
    const near = own.find((o) => {
      const [a, b] = factParts(o.fact);
      return Math.abs(a - b) === 1;
    });
    if (near) {
      const [a, b] = factParts(near.fact);
      const d = Math.min(a, b);
      push(
        'near-doubles',
        `${near.text} is next to a double: ${d} + ${d} is ${2 * d}, and one more makes ${a + b}. Ask for the double first, then the fact beside it.`,
      );
    }
  }
  push(
    'flash-cards',
    `Write each missed fact (${list}) on a card with the answer on the back, with a few other ${many} the child knows. A fact answered quickly and right goes on the “got it” pile; the others go back for one more round. Five minutes is plenty.`,
  );
  push(
    'timer-game',
    `Set a timer for two minutes. Take turns at the table: one calls out ${one} (such as ${first?.text ?? `one with ${n}`}), the next answers. Count the table’s answers together and try to beat that count next time; the score belongs to everyone.`,
  );
  return out;
}
