import { DateTime } from 'luxon';
import { describe, expect, test } from 'vitest';
import { IntlNamedTimeZone } from './intl-time-zone-plugin';

// The grid used @fullcalendar/luxon3 before; these compare with luxon itself, which reads the same IANA tz data.
const luxonArray = (ms: number, zone: string) => {
  const d = DateTime.fromMillis(ms, { zone });
  return [d.year, d.month - 1, d.day, d.hour, d.minute, d.second, d.millisecond];
};
const luxonOffset = (a: number[], zone: string) =>
  DateTime.fromObject({ year: a[0], month: a[1]! + 1, day: a[2], hour: a[3], minute: a[4], second: a[5], millisecond: a[6] }, { zone }).offset;

// New York and Auckland (DST either side of the equator), Lord Howe (30-minute DST), Chatham (UTC+12:45),
// Kathmandu (UTC+5:45), Santiago (changes at midnight), plus a zone with no DST
const zones = ['America/New_York', 'Pacific/Auckland', 'Australia/Lord_Howe', 'Pacific/Chatham', 'Asia/Kathmandu', 'America/Santiago', 'Asia/Tokyo'];

describe('named time zones without luxon', () => {
  test.each(zones)('when instants every 7 minutes through 2026 are read in %s, then the wall times are luxon\'s', (zone) => {
    const impl = new IntlNamedTimeZone(zone);
    const start = Date.UTC(2026, 0, 1);
    for (let ms = start; ms < Date.UTC(2027, 0, 1); ms += 7 * 60_000 + 13) {
      const ours = impl.timestampToArray(ms);
      if (ours.join() !== luxonArray(ms, zone).join()) expect([new Date(ms).toISOString(), ours]).toEqual([new Date(ms).toISOString(), luxonArray(ms, zone)]);
    }
  });

  test.each(zones)('when wall times every 10 minutes through 2026, gaps and overlaps included, are placed in %s, then the offsets are luxon\'s', (zone) => {
    const impl = new IntlNamedTimeZone(zone);
    for (let day = 0; day < 365; day += 1) {
      for (let minute = 0; minute < 24 * 60; minute += 10) {
        const civil = new Date(Date.UTC(2026, 0, 1 + day));
        const a = [civil.getUTCFullYear(), civil.getUTCMonth(), civil.getUTCDate(), Math.floor(minute / 60), minute % 60, 0, 0];
        const ours = impl.offsetForArray(a);
        const theirs = luxonOffset(a, zone);
        if (ours !== theirs) expect([a.join(), ours]).toEqual([a.join(), theirs]);
      }
    }
  });
});
