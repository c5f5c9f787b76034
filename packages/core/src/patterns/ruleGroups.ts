/**
 * Related error rules that are one difficulty seen from different sides: a child working
 * on it often moves from one of them to another (common practice, no source).
 * `RULE_GROUPS[0].ruleIds` → `['sub.borrow-across-zero', 'sub.borrow-from-zero', …]`.
 */
export const RULE_GROUPS: readonly {
  readonly group: string;
  readonly title: string;
  readonly ruleIds: readonly string[];
}[] = [
  {
    group: 'zero-regrouping',
    title: 'Regrouping across zeros',
    ruleIds: [
      'sub.borrow-across-zero',
      'sub.borrow-from-zero',
      'sub.zero-minus-n-is-n',
      'sub.zero-minus-n-is-zero',
    ],
  },
];
