import { describe, expect, test } from 'vitest';
import { monthLabel, previousMonth } from './months';

describe('billing months', () => {
  test('when it is already 1 March in UTC but still 28 February in New York, then the previous month is January', () => {
    // 2026-03-01T03:00Z is 2026-02-28 22:00 EST (UTC−5; IANA tz database)
    expect(previousMonth(new Date('2026-03-01T03:00:00Z'), 'America/New_York')).toBe('2026-01');
    expect(previousMonth(new Date('2026-03-01T03:00:00Z'), 'UTC')).toBe('2026-02');
  });

  test('when it is January, then the previous month is December of the year before', () => {
    expect(previousMonth(new Date('2026-01-15T12:00:00Z'), 'Asia/Tokyo')).toBe('2025-12');
  });

  test('when a month is labelled, then it reads as the month and year', () => {
    expect(monthLabel('2026-03')).toBe('March 2026');
    expect(monthLabel('2025-12')).toBe('December 2025');
  });
});
