/** The periods the Patterns page offers; `custom` reads its own from/to. */
export const PERIODS = [
  { value: '4w', label: 'Last 4 weeks', days: 28 },
  { value: '8w', label: 'Last 8 weeks', days: 56 },
  { value: '12w', label: 'Last 12 weeks', days: 84 },
  { value: 'all', label: 'All time', days: null },
  { value: 'custom', label: 'Choose dates', days: null },
] as const;

export type Period = (typeof PERIODS)[number]['value'];

export const DEFAULT_PERIOD: Period = '12w';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A local calendar day as YYYY-MM-DD: `localDay(new Date(2026, 2, 4))` → `'2026-03-04'`. */
export function localDay(date: Date): string {
  const m = String(date.getMonth() + 1).padStart(2, '0');
  const d = String(date.getDate()).padStart(2, '0');
  return `${date.getFullYear()}-${m}-${d}`;
}

export function isPeriod(value: string | null): value is Period {
  return PERIODS.some((p) => p.value === value);
}

/**
 * The day range of a period: `rangeOf('4w', {}, new Date(2026, 2, 29))` →
 * `{ from: '2026-03-02', to: undefined }` (the 28 days up to and including today).
 */
export function rangeOf(
  period: Period,
  custom: { from?: string | null; to?: string | null },
  today = new Date(),
): { from?: string; to?: string } {
  if (period === 'all') return {};
  if (period === 'custom') {
    return {
      ...(custom.from && DAY.test(custom.from) ? { from: custom.from } : {}),
      ...(custom.to && DAY.test(custom.to) ? { to: custom.to } : {}),
    };
  }
  const days = PERIODS.find((p) => p.value === period)?.days ?? 84;
  const start = new Date(today.getFullYear(), today.getMonth(), today.getDate() - (days - 1));
  return { from: localDay(start) };
}
