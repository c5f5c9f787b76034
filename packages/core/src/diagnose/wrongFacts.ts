/**
 * The wrong results a child plausibly writes for one basic fact — the one list both the
 * single-slip check and the rule-plus-slip search use (common practice, no source):
 * a sum or difference off by one or two (a counting slip; a difference stays a digit 0–9),
 * a product off by one or two, or the product of a neighbouring fact (7 × 8 → 48 or 63),
 * nearest first.
 * `wrongFacts('x', 7, 8)` → `[55, 57, 54, 58, 63, 49, 64, 48]`; `wrongFacts('-', 9, 8)` → `[0, 2, 3]`.
 */
export function wrongFacts(op: '+' | '-' | 'x', a: number, b: number): number[] {
  const right = op === '+' ? a + b : op === '-' ? a - b : a * b;
  const out: number[] = [];
  const push = (w: number): void => {
    if (w === right || w < 0 || out.includes(w)) return;
    if (op === '-' && w > 9) return;
    if (op === 'x' && w > 81) return;
    out.push(w);
  };
  for (const d of [-1, 1, -2, 2]) push(right + d);
  if (op === 'x') {
    push(a * (b + 1));
    push(a * (b - 1));
    push((a + 1) * b);
    push((a - 1) * b);
  }
  return out;
}

/**
 * The wrong products a child plausibly writes for one cell of a long multiplication: the list
 * of `wrongFacts`, less a product short by exactly the carry that is then added (`carryIn`),
 * which is a carry not added — a slip of its own (`dropCarryAt`), not a fact to practise. The
 * one list the single-fact check, the rule-plus-slip search and the evaluation table use.
 * `wrongProducts(7, 8, 2)` → `[55, 57, 58, 63, 49, 64, 48]` (54 is 56 with the carried 2 not added).
 */
export function wrongProducts(a: number, b: number, carryIn: number): number[] {
  return wrongFacts('x', a, b).filter((w) => !(carryIn > 0 && w === a * b - carryIn));
}
