import { describe, expect, it } from 'vitest';

import { isSameDayFollowUp } from './calm-day';

describe('isSameDayFollowUp', () => {
  it('flags a follow-up on the day of a reviewed sitting, whatever the hour', () => {
    expect(isSameDayFollowUp('2026-03-02', ['2026-03-01T18:00', '2026-03-02T09:30'])).toBe(true);
    expect(isSameDayFollowUp('2026-03-02T16:45', ['2026-03-02T09:30'])).toBe(true);
  });

  it('leaves a follow-up on another day alone', () => {
    expect(isSameDayFollowUp('2026-03-03', ['2026-03-02T23:59'])).toBe(false);
    expect(isSameDayFollowUp('2026-03-03', [])).toBe(false);
  });

  it('says nothing for a date that is not filled in yet', () => {
    expect(isSameDayFollowUp('', ['2026-03-02T09:30'])).toBe(false);
  });
});
