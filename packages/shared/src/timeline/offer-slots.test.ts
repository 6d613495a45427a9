import { describe, expect, it } from 'vitest';
import { offerSlots } from './offer-slots';
import type { TimelineBlockInput } from './timeline-schemas';

const model = { pairs: [], retuneMinutesPerNm: 0, warmupAfterMaintenanceMinutes: 30, pulseCheckMinutes: 5, defaultBaseMinutes: 20 };
const state = { configurationKey: 'fundamental', nm: 800 };

function take(gen: Generator<{ start: Date; end: Date }, void, boolean | undefined>, count: number, keep = (_: { start: Date }) => true) {
  const kept: { start: Date; end: Date }[] = [];
  let next = gen.next();
  for (let i = 0; !next.done && kept.length < count && i < 500; i += 1) {
    const ok = keep(next.value);
    if (ok) kept.push(next.value);
    next = gen.next(ok);
  }
  return kept.map((s) => [s.start.toISOString(), s.end.toISOString()]);
}

// New York wall times from the IANA tz database: UTC−4 until 02:00 on Sunday 1 Nov 2026, UTC−5 after.
describe('slots offered to a displaced booking', () => {
  it('when the booking was on a Friday evening before the clocks go back, then the offers are Monday working hours in standard time', () => {
    const window: TimelineBlockInput = { id: 'w', kind: 'maintenance', start: '2026-10-30T20:00:00Z', end: '2026-10-30T23:00:00Z' };
    const gen = offerSlots([window], { start: '2026-10-30T21:00:00Z', end: '2026-10-30T23:00:00Z', state }, { model, horizonEnd: '2026-12-31T00:00:00Z', timeZone: 'America/New_York' });
    // Monday 2 Nov 08:00 EST = 13:00Z; the step of 2 h gives 10:00 and 12:00 EST.
    expect(take(gen, 3)).toEqual([
      ['2026-11-02T13:00:00.000Z', '2026-11-02T15:00:00.000Z'],
      ['2026-11-02T15:00:00.000Z', '2026-11-02T17:00:00.000Z'],
      ['2026-11-02T17:00:00.000Z', '2026-11-02T19:00:00.000Z'],
    ]);
  });

  it('when a slot is refused by the caller, then the next candidate starts a quarter hour later and the kept ones never overlap', () => {
    const gen = offerSlots([], { start: '2026-06-08T12:00:00Z', end: '2026-06-08T15:00:00Z', state }, { model, horizonEnd: '2026-07-01T00:00:00Z', timeZone: 'America/New_York' });
    // Monday 8 Jun 2026 08:00 EDT = 12:00Z; refuse the first candidate.
    let first = true;
    const kept = take(gen, 2, () => (first ? ((first = false), false) : true));
    expect(kept).toEqual([
      ['2026-06-08T12:15:00.000Z', '2026-06-08T15:15:00.000Z'],
      ['2026-06-08T15:15:00.000Z', '2026-06-08T18:15:00.000Z'],
    ]);
  });

  it('when the booking is longer than the working day, then the offers fall back to any time', () => {
    const gen = offerSlots([], { start: '2026-06-08T12:00:00Z', end: '2026-06-08T23:00:00Z', state }, { model, horizonEnd: '2026-06-20T00:00:00Z', timeZone: 'America/New_York' });
    const kept = take(gen, 2);
    expect(kept[0]).toEqual(['2026-06-08T12:00:00.000Z', '2026-06-08T23:00:00.000Z']);
    expect(kept).toHaveLength(2);
  });
});
