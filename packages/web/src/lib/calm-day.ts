/** The calendar day of a local date or date-time: `'2026-03-02T09:30'` → `'2026-03-02'`. */
const dayOf = (value: string) => value.slice(0, 10);

/**
 * `true` when a follow-up (a review sitting, a review plan) falls on the same calendar day as the
 * sitting it reviews — review tends to go better on a calmer, separate day (common practice, no
 * source). Takes local dates (`YYYY-MM-DD`) or local date-times (`YYYY-MM-DDTHH:mm`):
 * `isSameDayFollowUp('2026-03-02', ['2026-03-02T09:30'])` → `true`.
 */
export function isSameDayFollowUp(followUpOn: string, reviewed: readonly string[]): boolean {
  if (!/^\d{4}-\d{2}-\d{2}/.test(followUpOn)) return false;
  const day = dayOf(followUpOn);
  return reviewed.some((when) => dayOf(when) === day);
}
