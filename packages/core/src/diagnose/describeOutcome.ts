/**
 * The closing sentence of a rule's explanation. The usual working's answer is not repeated
 * here: every screen shows it once beside the child's answer. `diagnose` keeps this sentence
 * on the first-ranked explanation only, so a list of rules does not say it again and again.
 * `describeOutcome('81 − 38', '57')` → `'Worked that way, 81 − 38 gives 57.'`
 */
export function describeOutcome(problem: string, childAnswer: string): string {
  return `Worked that way, ${problem} gives ${childAnswer}.`;
}
