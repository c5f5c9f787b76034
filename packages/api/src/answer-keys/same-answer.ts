/**
 * Whether a child's answer is the key's answer, ignoring spacing, case, thousands
 * commas and the kind of minus sign: `'1,128'` = `'1128'`, `'7 r 3'` = `'7 R 3'`.
 * A different form (`'2/4'` for `'1/2'`) is a different answer; the parent decides.
 */
export function sameAnswer(a: string, b: string): boolean {
  return normalise(a) === normalise(b);
}

function normalise(text: string): string {
  return text
    .toLowerCase()
    .replace(/[−–]/g, '-')
    .replace(/(\d),(?=\d{3}(\D|$))/g, '$1')
    .replace(/\s+/g, '');
}
