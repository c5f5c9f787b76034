import type { ResidueWorking } from './types.js';

/**
 * The residue of a whole number (digit string) with its working: digit sums for nines,
 * alternating digit sums from the ones for elevens.
 * `residueOf('347', 9)` → `{ number: '347', working: ['3 + 4 + 7 = 14', '1 + 4 = 5'], residue: 5 }`;
 * `residueOf('347', 11)` → `{ number: '347', working: ['7 − 4 + 3 = 6'], residue: 6 }`.
 */
export function residueOf(number: string, modulus: 9 | 11): ResidueWorking {
  const working: string[] = [];
  if (modulus === 9) {
    let current = number;
    while (current.length > 1) {
      let sum = 0;
      for (const ch of current) sum += Number(ch);
      working.push(`${current.split('').join(' + ')} = ${sum}`);
      current = String(sum);
    }
    const digit = Number(current);
    if (digit === 9) working.push('9 counts as 0');
    return { number, working, residue: digit % 9 };
  }
  let sum = 0;
  let text = '';
  for (let k = 0; k < number.length; k += 1) {
    const d = Number(number[number.length - 1 - k]);
    sum += k % 2 === 0 ? d : -d;
    text += k === 0 ? String(d) : ` ${k % 2 === 0 ? '+' : '−'} ${d}`;
  }
  if (number.length > 1) working.push(`${text} = ${sum < 0 ? `−${-sum}` : sum}`);
  const residue = ((sum % 11) + 11) % 11;
  if (residue !== sum) {
    const times = residue - sum;
    working.push(
      times > 0
        ? `${sum < 0 ? `−${-sum}` : sum} + ${times} = ${residue}`
        : `${sum} − ${-times} = ${residue}`,
    );
  }
  return { number, working, residue };
}
