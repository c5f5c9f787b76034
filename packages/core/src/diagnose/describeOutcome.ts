/**
 * The closing sentence of a rule's explanation.
 * `describeOutcome('81 − 38', '57', '43')` → `'Worked that way, 81 − 38 gives 57; the usual working gives 43.'`
 */
export function describeOutcome(problem: string, childAnswer: string, expected: string): string {
  return `Worked that way, ${problem} gives ${childAnswer}; the usual working gives ${expected}.`;
}
