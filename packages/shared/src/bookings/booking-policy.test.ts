import { describe, expect, it } from 'vitest';
import { cancellationFeePercent, cancellationWindows } from './booking-policy';
import { localDate, wallTimeAt } from '../time/zoned-time';

const policy = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };
const start = new Date('2026-12-10T14:00:00Z');
const hoursBefore = (h: number) => new Date(start.getTime() - h * 3_600_000);

describe('cancellation fee windows (facility policy defaults: free ≥ 72 h, 50 % ≥ 24 h, else 100 %)', () => {
  it('when cancelled 73 h before, then free; 71 h → 50 %; 25 h → 50 %; 23 h → 100 %', () => {
    expect([73, 71, 25, 23].map((h) => cancellationFeePercent(start, hoursBefore(h), policy))).toEqual([0, 50, 50, 100]);
  });
  it('when cancelled exactly at a boundary, then the cheaper window applies', () => {
    expect(cancellationFeePercent(start, hoursBefore(72), policy)).toBe(0);
    expect(cancellationFeePercent(start, hoursBefore(24), policy)).toBe(50);
  });
  it('when cancelled after the start, then 100 %', () => {
    expect(cancellationFeePercent(start, hoursBefore(-1), policy)).toBe(100);
  });

  it('when the windows are listed for a start just after the New York fall-back, then they begin 72 and 24 real hours before it and agree with the fee rule', () => {
    // 2026-11-02 09:00 EST = 14:00Z. 72 h earlier is 2026-10-30 10:00 EDT (the clock fell back an hour on 1 November; IANA tz).
    const start = new Date('2026-11-02T14:00:00Z');
    const w = cancellationWindows(start, { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 });
    expect(w.map((x) => x.percent)).toEqual([0, 50, 100]);
    expect(w[1]!.from!.toISOString()).toBe('2026-10-30T14:00:00.000Z');
    expect(localDate(w[1]!.from!, 'America/New_York')).toBe('2026-10-30');
    expect(wallTimeAt(w[1]!.from!, 'America/New_York').hour).toBe(10);
    expect(w[2]!.from!.toISOString()).toBe('2026-11-01T14:00:00.000Z');
    const policy = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };
    // The boundary instant belongs to the cheaper window ("until 72 h before" includes 72 h exactly).
    for (const x of w) {
      if (x.from) expect(cancellationFeePercent(start, new Date(x.from.getTime() + 1), policy)).toBe(x.percent);
      if (x.percent < 100) expect(cancellationFeePercent(start, x.until, policy)).toBe(x.percent);
    }
  });
});
