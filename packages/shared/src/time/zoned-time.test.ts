import { describe, expect, it } from 'vitest';
import { localDate, offsetMinutesAt, resolveWallTime, zonedToUtc } from './zoned-time';

const NY = 'America/New_York';

describe('zoned time (IANA tz database: America/New_York, DST ends 2026-11-01 06:00 UTC, begins 2026-03-08 07:00 UTC)', () => {
  it('when it is winter in New York, then the offset is −5 h, and −4 h in summer', () => {
    expect(offsetMinutesAt(new Date('2026-01-15T12:00:00Z'), NY)).toBe(-300);
    expect(offsetMinutesAt(new Date('2026-07-15T12:00:00Z'), NY)).toBe(-240);
  });

  it('when a session runs 00:30–03:30 wall time on 2026-11-01, then it lasts four real hours', () => {
    const start = zonedToUtc({ year: 2026, month: 11, day: 1, hour: 0, minute: 30 }, NY);
    const end = zonedToUtc({ year: 2026, month: 11, day: 1, hour: 3, minute: 30 }, NY);
    expect(start.toISOString()).toBe('2026-11-01T04:30:00.000Z');
    expect((end.getTime() - start.getTime()) / 3_600_000).toBe(4);
  });

  it('when a session runs 00:30–03:30 wall time on 2026-03-08, then it lasts two real hours', () => {
    const start = zonedToUtc({ year: 2026, month: 3, day: 8, hour: 0, minute: 30 }, NY);
    const end = zonedToUtc({ year: 2026, month: 3, day: 8, hour: 3, minute: 30 }, NY);
    expect((end.getTime() - start.getTime()) / 3_600_000).toBe(2);
  });

  it('when a wall time falls in the spring-forward gap, then it is shifted forward by the gap (RFC 5545 §3.3.5)', () => {
    const r = resolveWallTime({ year: 2026, month: 3, day: 8, hour: 2, minute: 30 }, NY);
    expect(r.resolution).toBe('shifted');
    expect(r.instant.toISOString()).toBe('2026-03-08T07:30:00.000Z'); // 03:30 EDT
  });

  it('when a wall time occurs twice at fall-back, then the first occurrence is taken (RFC 5545 §3.3.5)', () => {
    const r = resolveWallTime({ year: 2026, month: 11, day: 1, hour: 1, minute: 30 }, NY);
    expect(r.resolution).toBe('ambiguous');
    expect(r.instant.toISOString()).toBe('2026-11-01T05:30:00.000Z'); // 01:30 EDT
  });

  it('when an instant is late evening in New York, then its local date is the New York date', () => {
    expect(localDate(new Date('2026-12-02T03:00:00Z'), NY)).toBe('2026-12-01');
  });
});
