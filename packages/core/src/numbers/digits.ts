// Small digit helpers shared by the column methods. Digits are kept ones-first
// (index 0 is the ones place) so a column index is also the power of ten.

const PLACE_NAMES = [
  'ones',
  'tens',
  'hundreds',
  'thousands',
  'ten thousands',
  'hundred thousands',
  'millions',
  'ten millions',
  'hundred millions',
  'billions',
  'ten billions',
  'hundred billions',
] as const;

/** `digitsOf('304')` → `[4, 0, 3]` (ones first). */
export function digitsOf(text: string): number[] {
  const out: number[] = new Array<number>(text.length);
  for (let i = 0; i < text.length; i += 1) out[i] = text.charCodeAt(text.length - 1 - i) - 48;
  return out;
}

/** `textOfDigits([9, 3, 1, 0])` → `'139'` (ones first in, leading zeros dropped, `'0'` for none). */
export function textOfDigits(digits: readonly number[]): string {
  let end = digits.length - 1;
  while (end > 0 && digits[end] === 0) end -= 1;
  let out = '';
  for (let i = end; i >= 0; i -= 1) out += String(digits[i] ?? 0);
  return out === '' ? '0' : out;
}

/** `placeName(2)` → `'hundreds'`; beyond the named places, `'10^13 place'`. */
export function placeName(index: number): string {
  return PLACE_NAMES[index] ?? `10^${index} place`;
}

/** `placeColumn(1)` → `'tens column'`, used in explanations. */
export function placeColumn(index: number): string {
  return `${placeName(index)} column`;
}

/** `stripLeadingZeros('0042')` → `'42'`; `'000'` → `'0'`. */
export function stripLeadingZeros(text: string): string {
  let i = 0;
  while (i < text.length - 1 && text[i] === '0') i += 1;
  return text.slice(i);
}

/** `trailingZeros('4300')` → `2`; `'0'` → `0`. */
export function trailingZeros(text: string): number {
  if (/^0+$/.test(text)) return 0;
  let n = 0;
  while (n < text.length && text[text.length - 1 - n] === '0') n += 1;
  return n;
}

/** `compareWhole('75', '304')` → `-1` (numeric order of digit strings without leading zeros). */
export function compareWhole(a: string, b: string): -1 | 0 | 1 {
  if (a.length !== b.length) return a.length < b.length ? -1 : 1;
  if (a === b) return 0;
  return a < b ? -1 : 1;
}

/** `gcd(12, 18)` → `6`. */
export function gcd(a: number, b: number): number {
  let x = Math.abs(a);
  let y = Math.abs(b);
  while (y !== 0) [x, y] = [y, x % y];
  return x;
}
