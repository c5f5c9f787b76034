const NUMBER = /\d+(?:\.\d+)?/g;

/**
 * Writes every whole number of four digits or more in a sentence with a comma between each
 * group of three (4455 → 4,455), as the notebook writes numbers for a parent. Only the whole
 * part of a decimal is grouped (1250.75 → 1,250.75; 0.12345 stays). Numbers already grouped,
 * numbers with a leading 0 and digits joined to letters are left as they are.
 * `groupThousands('Worked that way, 960 + 4455 gives 4325.')` → `'Worked that way, 960 + 4,455 gives 4,325.'`
 */
export function groupThousands(text: string): string {
  return text.replace(NUMBER, (token, at: number) => {
    const whole = token.split('.')[0] as string;
    if (whole.length < 4 || whole.startsWith('0')) return token;
    const before = text[at - 1] ?? '';
    const after = text.slice(at + token.length, at + token.length + 2);
    if (/[\p{L}_,]/u.test(before) || /^[\p{L}_]|^,\d/u.test(after)) return token;
    return whole.replace(/\B(?=(\d{3})+$)/g, ',') + token.slice(whole.length);
  });
}
