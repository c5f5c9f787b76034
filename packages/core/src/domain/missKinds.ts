/**
 * What sort of problem a miss is, as the notebook groups them: the engine's problem kinds
 * folded into the families a parent names, and a word problem (one with the child's number
 * sentences or an interview stage recorded) on its own.
 * `MissKind.money` → `'money'`.
 */
export const MissKind = {
  whole: 'whole',
  fraction: 'fraction',
  decimal: 'decimal',
  money: 'money',
  time: 'time',
  word: 'word',
  other: 'other',
} as const;
export type MissKind = (typeof MissKind)[keyof typeof MissKind];

export const MISS_KINDS: readonly MissKind[] = Object.values(MissKind);

/** Parent-facing names, for filters and lists. */
export const MISS_KIND_LABEL: Readonly<Record<MissKind, string>> = {
  whole: 'Whole numbers',
  fraction: 'Fractions',
  decimal: 'Decimals',
  money: 'Money',
  time: 'Clock times',
  word: 'Word problem',
  other: 'Not read by the checkers',
};

/** `isMissKind('money')` → `true`. */
export function isMissKind(value: unknown): value is MissKind {
  return typeof value === 'string' && (MISS_KINDS as readonly string[]).includes(value);
}
