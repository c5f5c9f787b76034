/**
 * For column methods that write one digit per column: when the rule's result and the
 * child's answer differ in exactly one digit, in a column the rule did not touch, that
 * digit is a fact slip beside the rule. Returns the column and both digits, or null.
 * `digitSlipBesideRule('53', '54', [1], [1, 1])` → `{ column: 0, ruleDigit: 3, childDigit: 4 }`.
 */
export function digitSlipBesideRule(
  ruleResult: string,
  answer: string,
  fired: readonly number[],
  writtenWidths: readonly number[],
): { column: number; ruleDigit: number; childDigit: number } | null {
  const width = Math.max(ruleResult.length, answer.length);
  let found = -1;
  for (let k = 0; k < width; k += 1) {
    const r = ruleResult[ruleResult.length - 1 - k] ?? '0';
    const c = answer[answer.length - 1 - k] ?? '0';
    if (r !== c) {
      if (found >= 0) return null;
      found = k;
    }
  }
  if (found < 0 || fired.includes(found)) return null;
  if (found >= writtenWidths.length) return null;
  for (let k = 0; k < found; k += 1) if (writtenWidths[k] !== 1) return null;
  return {
    column: found,
    ruleDigit: Number(ruleResult[ruleResult.length - 1 - found] ?? '0'),
    childDigit: Number(answer[answer.length - 1 - found] ?? '0'),
  };
}
