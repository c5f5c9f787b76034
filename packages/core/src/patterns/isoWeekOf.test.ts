import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { isoWeekOf } from './isoWeekOf.js';

const table = JSON.parse(
  readFileSync(new URL('../../../../fixtures/core/iso-weeks.json', import.meta.url), 'utf8'),
) as { rows: [string, string, string][] };

describe('isoWeekOf', () => {
  // Reference: Python 3 datetime.date.isocalendar(), see the fixture's "source".
  it.each(table.rows)('%s is in %s starting %s', (date, week, monday) => {
    const w = isoWeekOf(date);
    expect(w.week).toBe(week);
    expect(w.from).toBe(monday);
  });

  // ISO 8601 year-boundary examples as listed in the Wikipedia article "ISO week date" (from memory).
  it.each([
    ['2005-01-01', '2004-W53'],
    ['2007-01-01', '2007-W01'],
    ['2007-12-31', '2008-W01'],
    ['2008-12-29', '2009-W01'],
    ['2009-12-31', '2009-W53'],
    ['2010-01-03', '2009-W53'],
  ])('%s → %s', (date, week) => {
    expect(isoWeekOf(date).week).toBe(week);
  });

  it('gives Monday to Sunday', () => {
    expect(isoWeekOf('2026-03-04')).toEqual({
      week: '2026-W10',
      from: '2026-03-02',
      to: '2026-03-08',
    });
  });

  it('refuses a date that does not exist', () => {
    expect(() => isoWeekOf('2026-02-30')).toThrow(/real calendar date/);
  });
});
