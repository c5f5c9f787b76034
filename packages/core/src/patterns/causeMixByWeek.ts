import { CAUSES, type Cause } from '../domain/causes.js';
import { dateOfDay, dayNumber } from './dayNumber.js';
import { isoWeekOf } from './isoWeekOf.js';
import type { PatternMiss, WeekCauseMix } from './types.js';

/**
 * Misses per ISO week by cause, oldest week first. Every week from the first to the last
 * (or from `from` to `to` when given) is listed, empty weeks with zeros, so a chart shows
 * quiet weeks as quiet.
 * `causeMixByWeek([{ occurredOn: '2026-03-04', cause: 'fact', … }])` →
 * `[{ week: '2026-W10', from: '2026-03-02', to: '2026-03-08', total: 1, causes: { slip: 0, fact: 1, … } }]`.
 */
export function causeMixByWeek(
  misses: readonly Pick<PatternMiss, 'occurredOn' | 'cause'>[],
  options: { readonly from?: string; readonly to?: string } = {},
): WeekCauseMix[] {
  const days = misses.map((m) => dayNumber(m.occurredOn));
  const first = options.from ?? (days.length ? dateOfDay(Math.min(...days)) : undefined);
  const last = options.to ?? (days.length ? dateOfDay(Math.max(...days)) : undefined);
  if (first === undefined || last === undefined || first > last) return [];
  const weeks = new Map<string, WeekCauseMix & { causes: Record<Cause, number> }>();
  for (let monday = dayNumber(isoWeekOf(first).from); monday <= dayNumber(last); monday += 7) {
    const w = isoWeekOf(dateOfDay(monday));
    const causes = Object.fromEntries(CAUSES.map((c) => [c, 0])) as Record<Cause, number>;
    weeks.set(w.week, { ...w, total: 0, causes });
  }
  for (const m of misses) {
    const week = weeks.get(isoWeekOf(m.occurredOn).week);
    if (week === undefined) continue;
    weeks.set(week.week, {
      ...week,
      total: week.total + 1,
      causes: { ...week.causes, [m.cause]: (week.causes[m.cause] ?? 0) + 1 },
    });
  }
  return [...weeks.values()];
}
