import { dateOfDay, dayNumber } from './dayNumber.js';

export interface IsoWeek {
  /** `'2026-W10'`. */
  readonly week: string;
  /** The week's Monday and Sunday. */
  readonly from: string;
  readonly to: string;
}

/**
 * The ISO 8601 week of a date: weeks start on Monday and week 1 is the one holding the
 * year's first Thursday, so early January can belong to the year before.
 * `isoWeekOf('2021-01-03')` → `{ week: '2020-W53', from: '2020-12-28', to: '2021-01-03' }`.
 */
export function isoWeekOf(date: string): IsoWeek {
  const day = dayNumber(date);
  // 1970-01-01 was a Thursday: (day + 3) mod 7 is 0 on Mondays.
  const monday = day - ((((day + 3) % 7) + 7) % 7);
  const thursday = monday + 3;
  const year = Number(dateOfDay(thursday).slice(0, 4));
  const week = Math.floor((thursday - dayNumber(`${year}-01-01`)) / 7) + 1;
  return {
    week: `${year}-W${String(week).padStart(2, '0')}`,
    from: dateOfDay(monday),
    to: dateOfDay(monday + 6),
  };
}
