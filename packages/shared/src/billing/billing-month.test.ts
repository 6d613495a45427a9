import { describe, expect, it } from 'vitest';
import { checkBillableMonth, monthBounds } from './billing-month';

const NY = 'America/New_York';
const at = (iso: string) => new Date(iso);

describe('billing months in the facility zone', () => {
  it('when November 2026 is bounded in New York, then it starts on EDT and ends on EST: 721 h (IANA tz: US rule, DST ends first Sunday of November, 2026-11-01 02:00 EDT → 01:00 EST)', () => {
    const b = monthBounds('2026-11', NY);
    // 2026-11-01 00:00 EDT (UTC−4) = 04:00Z; 2026-12-01 00:00 EST (UTC−5) = 05:00Z.
    expect(b.startsAt.toISOString()).toBe('2026-11-01T04:00:00.000Z');
    expect(b.endsAt.toISOString()).toBe('2026-12-01T05:00:00.000Z');
    // 30 days × 24 h + the repeated hour at the fall-back = 721 h (by hand)
    expect((b.endsAt.getTime() - b.startsAt.getTime()) / 3_600_000).toBe(721);
  });

  it('when March 2027 is bounded in New York, then it starts on EST and ends on EDT: 743 h (IANA tz: DST begins second Sunday of March, 2027-03-14 02:00 EST → 03:00 EDT)', () => {
    const b = monthBounds('2027-03', NY);
    expect(b.startsAt.toISOString()).toBe('2027-03-01T05:00:00.000Z');
    expect(b.endsAt.toISOString()).toBe('2027-04-01T04:00:00.000Z');
    // 31 days × 24 h − the skipped hour = 743 h (by hand)
    expect((b.endsAt.getTime() - b.startsAt.getTime()) / 3_600_000).toBe(743);
  });

  it('when it is 23:59:59 EST on 30 November in New York (already 1 December in UTC), then November has not ended; at midnight EST it has', () => {
    const before = checkBillableMonth({ month: '2026-11', timeZone: NY, now: at('2026-12-01T04:59:59.999Z'), firstBookingYear: 2025 });
    expect(before.ok).toBe(false);
    if (!before.ok) {
      expect(before.code).toBe('month_not_ended');
      expect(before.details).toMatchObject({ endsAt: '2026-12-01T05:00:00.000Z', endsAtLocal: '2026-12-01 00:00', latestMonth: '2026-10', timeZone: NY });
    }
    const after = checkBillableMonth({ month: '2026-11', timeZone: NY, now: at('2026-12-01T05:00:00.000Z'), firstBookingYear: 2025 });
    expect(after.ok).toBe(true);
  });

  it('when March 2027 ends on EDT, then at 03:59Z on 1 April (23:59 EDT on 31 March) it is open and at 04:00Z it has ended', () => {
    expect(checkBillableMonth({ month: '2027-03', timeZone: NY, now: at('2027-04-01T03:59:00Z'), firstBookingYear: 2026 }).ok).toBe(false);
    expect(checkBillableMonth({ month: '2027-03', timeZone: NY, now: at('2027-04-01T04:00:00Z'), firstBookingYear: 2026 }).ok).toBe(true);
  });

  it('when the month is year 0000, before the first booking year, or years ahead, then it is out of range with the range that works', () => {
    const now = at('2026-12-04T15:00:00Z');
    for (const month of ['0000-01', '2024-12', '2031-06']) {
      const v = checkBillableMonth({ month, timeZone: NY, now, firstBookingYear: 2025 });
      expect(v.ok).toBe(false);
      if (!v.ok) {
        expect(v.code).toBe('month_out_of_range');
        expect(v.details).toMatchObject({ month, earliestMonth: '2025-01', latestMonth: '2026-11' });
      }
    }
    expect(checkBillableMonth({ month: '2025-01', timeZone: NY, now, firstBookingYear: 2025 }).ok).toBe(true);
  });

  it('when the month is the current one or next year, then it is refused as not ended, naming when it ends', () => {
    const now = at('2026-12-04T15:00:00Z');
    for (const month of ['2026-12', '2027-06']) {
      const v = checkBillableMonth({ month, timeZone: NY, now, firstBookingYear: 2025 });
      expect(v.ok).toBe(false);
      if (!v.ok) expect(v.code).toBe('month_not_ended');
    }
  });

  it('when the facility has no booking yet, then the earliest month is January of the current year', () => {
    const v = checkBillableMonth({ month: '2025-12', timeZone: NY, now: at('2026-12-04T15:00:00Z'), firstBookingYear: null });
    expect(!v.ok && v.details.earliestMonth).toBe('2026-01');
  });
});
