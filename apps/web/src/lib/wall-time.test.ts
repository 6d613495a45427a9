import { describe, expect, test } from 'vitest';
import { fieldsToInstant, formatMinutes, instantToFields, minutesBetween } from './wall-time';

const ny = 'America/New_York';

describe('wall time ↔ instant in the facility zone', () => {
  // IANA tz database (America/New_York): DST ends 2026-11-01 02:00 EDT → 01:00 EST, so the night has 25 hours.
  test('when a booking runs 00:30–03:30 on 2026-11-01 in New York, then it lasts 4 h', () => {
    const start = fieldsToInstant({ date: '2026-11-01', time: '00:30' }, ny)!;
    const end = fieldsToInstant({ date: '2026-11-01', time: '03:30' }, ny)!;
    expect(start.instant.toISOString()).toBe('2026-11-01T04:30:00.000Z');
    expect(end.instant.toISOString()).toBe('2026-11-01T08:30:00.000Z');
    expect(minutesBetween(start.instant, end.instant)).toBe(240);
  });

  // IANA tz database: DST starts 2026-03-08 02:00 EST → 03:00 EDT, so the night has 23 hours.
  test('when a booking runs 00:30–03:30 on 2026-03-08 in New York, then it lasts 2 h', () => {
    const start = fieldsToInstant({ date: '2026-03-08', time: '00:30' }, ny)!;
    const end = fieldsToInstant({ date: '2026-03-08', time: '03:30' }, ny)!;
    expect(minutesBetween(start.instant, end.instant)).toBe(120);
    expect(start.resolution).toBe('exact');
    expect(start.note).toBeNull();
  });

  // RFC 5545 §3.3.5: a nonexistent local time is read with the offset before the gap (02:30 EST = 03:30 EDT).
  test('when the time falls in the spring-forward gap, then it is shifted and the note says so', () => {
    const gap = fieldsToInstant({ date: '2026-03-08', time: '02:30' }, ny)!;
    expect(gap.resolution).toBe('shifted');
    expect(gap.instant.toISOString()).toBe('2026-03-08T07:30:00.000Z');
    expect(gap.note).toBe('02:30 does not exist on that day (clocks go forward); it will be read as 03:30.');
  });

  // RFC 5545 §3.3.5: an ambiguous local time means the first occurrence (01:30 EDT = 05:30Z).
  test('when the time happens twice at fall-back, then the first occurrence is used and named', () => {
    const twice = fieldsToInstant({ date: '2026-11-01', time: '01:30' }, ny)!;
    expect(twice.resolution).toBe('ambiguous');
    expect(twice.instant.toISOString()).toBe('2026-11-01T05:30:00.000Z');
    expect(twice.note).toContain('first occurrence');
    expect(twice.note).toContain('UTC-4');
    expect(twice.note).toContain('UTC-5');
  });

  test('when an instant is turned into fields and back, then the same instant returns', () => {
    const instant = new Date('2026-07-14T18:45:00Z');
    const fields = instantToFields(instant, ny);
    expect(fields).toEqual({ date: '2026-07-14', time: '14:45' });
    expect(fieldsToInstant(fields, ny)!.instant.getTime()).toBe(instant.getTime());
  });

  test('when the fields are incomplete or impossible, then nothing is resolved', () => {
    expect(fieldsToInstant({ date: '2026-07-14', time: '' }, ny)).toBeNull();
    expect(fieldsToInstant({ date: '2026-13-01', time: '10:00' }, ny)).toBeNull();
  });

  test('when minutes are formatted, then hours and minutes read plainly', () => {
    expect(formatMinutes(240)).toBe('4 h');
    expect(formatMinutes(150)).toBe('2 h 30 min');
    expect(formatMinutes(45)).toBe('45 min');
  });
});
