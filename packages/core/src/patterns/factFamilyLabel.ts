/** `factFamilyLabel('x7')` → `'× and ÷ facts with 7'`; `factFamilyLabel('+8')` → `'+ and − facts with 8'`. */
export function factFamilyLabel(family: string): string {
  const n = family.slice(1);
  return family.startsWith('x') ? `× and ÷ facts with ${n}` : `+ and − facts with ${n}`;
}
