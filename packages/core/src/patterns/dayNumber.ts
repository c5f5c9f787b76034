/**
 * Days since 1970-01-01 of a YYYY-MM-DD date, on the proleptic Gregorian calendar (no time
 * zone can move it); throws when the text is not a real calendar date (a caller's mistake).
 * `dayNumber('1970-01-02')` → `1`.
 */
export function dayNumber(date: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (m === null) throw new Error(`“${date}” is not a date written YYYY-MM-DD`);
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const day = daysFromCivil(y, mo, d);
  const [y2, mo2, d2] = civilFromDays(day);
  if (y2 !== y || mo2 !== mo || d2 !== d) throw new Error(`“${date}” is not a real calendar date`);
  return day;
}

/** The YYYY-MM-DD date of a day number. `dateOfDay(1)` → `'1970-01-02'`. */
export function dateOfDay(day: number): string {
  const [y, m, d] = civilFromDays(day);
  return `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-${d < 10 ? '0' : ''}${d}`;
}

// Calendar arithmetic instead of a Date and an ISO string per call: the pattern maths
// converts every miss's day several times. The 400-year-era method is common practice
// (no source named); dayNumber.test.ts holds it to JavaScript's Date.

function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yearOfEra = y - era * 400;
  const dayOfYear = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const dayOfEra =
    yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
  return era * 146_097 + dayOfEra - 719_468;
}

function civilFromDays(days: number): [number, number, number] {
  const z = days + 719_468;
  const era = Math.floor(z / 146_097);
  const dayOfEra = z - era * 146_097;
  const yearOfEra = Math.floor(
    (dayOfEra -
      Math.floor(dayOfEra / 1460) +
      Math.floor(dayOfEra / 36_524) -
      Math.floor(dayOfEra / 146_096)) /
      365,
  );
  const dayOfYear =
    dayOfEra - (365 * yearOfEra + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100));
  const mp = Math.floor((5 * dayOfYear + 2) / 153);
  const day = dayOfYear - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return [yearOfEra + era * 400 + (month <= 2 ? 1 : 0), month, day];
}
