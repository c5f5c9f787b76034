/**
 * Time-of-day bands, read from the local clock time a sitting started:
 * morning 05:00–10:59, midday 11:00–13:59, afternoon 14:00–17:59,
 * evening 18:00–04:59 (common practice, no source: the bands are ours).
 */
export const TIME_OF_DAY_BANDS = [
  { name: 'morning', from: '05:00', to: '10:59' },
  { name: 'midday', from: '11:00', to: '13:59' },
  { name: 'afternoon', from: '14:00', to: '17:59' },
  { name: 'evening', from: '18:00', to: '04:59' },
] as const;

export type TimeOfDay = (typeof TIME_OF_DAY_BANDS)[number]['name'];

/** `'2026-03-02T09:30'` → `'morning'`. */
export function timeOfDayOf(startedAt: string): TimeOfDay {
  const hour = Number(startedAt.slice(11, 13));
  if (hour >= 5 && hour < 11) return 'morning';
  if (hour >= 11 && hour < 14) return 'midday';
  if (hour >= 14 && hour < 18) return 'afternoon';
  return 'evening';
}

const LOCAL_TIME = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/**
 * A local date and clock time without a zone, `YYYY-MM-DDTHH:mm` (seconds are dropped),
 * or null when it is not a real one. The zone is left out on purpose: the time of day is
 * the family's own clock.
 */
export function readLocalTime(text: string): string | null {
  const m = LOCAL_TIME.exec(text.trim());
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1, 6).map(Number) as [number, number, number, number, number];
  const s = m[6] === undefined ? 0 : Number(m[6]);
  if (y < 2000 || y > 2100 || h > 23 || mi > 59 || s > 59) return null;
  const date = new Date(Date.UTC(y, mo - 1, d));
  if (date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d) return null;
  return text.trim().slice(0, 16);
}
