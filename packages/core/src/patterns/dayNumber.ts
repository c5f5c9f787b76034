const DAY_MS = 86_400_000;

/**
 * Days since 1970-01-01 of a YYYY-MM-DD date, counted in UTC so no time zone moves it;
 * throws when the text is not a real calendar date (a caller's mistake).
 * `dayNumber('1970-01-02')` → `1`.
 */
export function dayNumber(date: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (m === null) throw new Error(`“${date}” is not a date written YYYY-MM-DD`);
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const time = Date.UTC(y, mo - 1, d);
  const back = new Date(time);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d)
    throw new Error(`“${date}” is not a real calendar date`);
  return time / DAY_MS;
}

/** The YYYY-MM-DD date of a day number. `dateOfDay(1)` → `'1970-01-02'`. */
export function dateOfDay(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}
