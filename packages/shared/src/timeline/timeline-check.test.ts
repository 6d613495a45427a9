import { describe, expect, it } from 'vitest';
import type { ChangeoverModelInput } from '../changeover/changeover-model';
import { checkTimeline, findAlternativeSlots } from './timeline-check';

const model: ChangeoverModelInput = {
  pairs: [{ from: 'opa_signal', to: 'dfg', baseMinutes: 45 }],
  retuneMinutesPerNm: 0.05,
  warmupAfterMaintenanceMinutes: 30,
  pulseCheckMinutes: 0,
  defaultBaseMinutes: 20,
};
const at = (hhmm: string) => `2030-03-04T${hhmm}:00Z`;
const signal = { configurationKey: 'opa_signal', nm: 1300 };
const dfg = { configurationKey: 'dfg', nm: 4000 };
const blocks = [
  { id: 'A', kind: 'booking' as const, start: at('09:00'), end: at('11:00'), state: signal },
  { id: 'M', kind: 'maintenance' as const, start: at('13:00'), end: at('14:00') },
  { id: 'B', kind: 'booking' as const, start: at('17:00'), end: at('19:00'), state: dfg },
];

describe('timeline checks', () => {
  it('when a DFG booking follows a signal booking by 30 minutes, then it is 15 short and can start at 11:45', () => {
    const result = checkTimeline(blocks, { start: at('11:30'), end: at('12:30'), state: { configurationKey: 'dfg', nm: 4500 } }, { model });
    // Hand-computed: signal → DFG base 45 min, gap 11:00–11:30 = 30 min; next is maintenance, needs nothing
    expect(result.before).toEqual({ neighbourId: 'A', neededMinutes: 45, availableMinutes: 30, shortfallMinutes: 15 });
    expect(result.after).toEqual({ neighbourId: 'M', neededMinutes: 0, availableMinutes: 30, shortfallMinutes: 0 });
    expect(result.ok).toBe(false);
    expect(result.earliestStart?.toISOString()).toBe('2030-03-04T11:45:00.000Z');
  });

  it('when a booking starts 10 minutes after maintenance, then the 30-minute warm-up is 20 short', () => {
    const result = checkTimeline(blocks, { start: at('14:10'), end: at('15:10'), state: signal }, { model });
    // Hand-computed: warm-up 30 after maintenance ending 14:00; signal → DFG before B needs 45, has 110
    expect(result.before).toEqual({ neighbourId: 'M', neededMinutes: 30, availableMinutes: 10, shortfallMinutes: 20 });
    expect(result.after).toEqual({ neighbourId: 'B', neededMinutes: 45, availableMinutes: 110, shortfallMinutes: 0 });
    expect(result.earliestStart?.toISOString()).toBe('2030-03-04T14:30:00.000Z');
  });

  it('when a booking fits its gap with changeover on both sides, then it is ok and starts where asked', () => {
    const result = checkTimeline(blocks, { start: at('14:30'), end: at('16:15'), state: signal }, { model });
    // Hand-computed: 14:30 = 14:00 + 30 warm-up; 16:15 + 45 = 17:00 = B's start
    expect(result.ok).toBe(true);
    expect(result.after?.shortfallMinutes).toBe(0);
    expect(result.earliestStart?.toISOString()).toBe('2030-03-04T14:30:00.000Z');
  });

  it('when the duration does not fit before the next booking, then the earliest start is after it, within the horizon', () => {
    const candidate = { start: at('14:00'), end: at('17:00'), state: dfg };
    // Hand-computed: 14:30 + 3 h = 17:30 > 17:00, so after B: 19:00 (DFG → DFG at the same nm needs 0)
    expect(checkTimeline(blocks, candidate, { model, horizonEnd: at('23:00') }).earliestStart?.toISOString()).toBe(
      '2030-03-04T19:00:00.000Z',
    );
    expect(checkTimeline(blocks, candidate, { model, horizonEnd: at('21:00') }).earliestStart).toBeNull();
  });

  it('when a candidate overlaps a booking, then the overlap is named; moving that booking itself is not an overlap', () => {
    expect(checkTimeline(blocks, { start: at('10:00'), end: at('11:00'), state: signal }, { model }).overlaps).toEqual(['A']);
    const moved = checkTimeline(blocks, { id: 'A', start: at('10:00'), end: at('11:00'), state: signal }, { model });
    expect(moved.overlaps).toEqual([]);
    expect(moved.ok).toBe(true);
  });

  it('when a candidate ends before it starts or times lack a zone, then it is refused', () => {
    expect(() => checkTimeline(blocks, { start: at('12:00'), end: at('11:00'), state: signal }, { model })).toThrow(
      expect.objectContaining({ code: 'invalid_interval' }),
    );
    expect(() => checkTimeline(blocks, { start: '2030-03-04T12:00:00', end: at('13:00'), state: signal }, { model })).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});

describe('alternative slots', () => {
  it('when three one-hour slots are asked from 08:00, then 08:00, 11:00 and 12:00 are offered', () => {
    const slots = findAlternativeSlots(
      blocks,
      { start: at('08:00'), end: at('09:00'), state: signal },
      { model, count: 3, horizonEnd: at('23:00'), stepMinutes: 60 },
    );
    // Hand-computed: 08:00–09:00 meets A (same state, 0 min); A ends 11:00; 12:00–13:00 meets maintenance
    expect(slots.map((s) => s.start.toISOString().slice(11, 16))).toEqual(['08:00', '11:00', '12:00']);
  });

  it('when the horizon leaves room for fewer slots, then only those are returned', () => {
    const slots = findAlternativeSlots(
      blocks,
      { start: at('14:00'), end: at('16:00'), state: dfg },
      { model, count: 5, horizonEnd: at('21:00'), stepMinutes: 60 },
    );
    // Hand-computed: 14:30–16:30 fits before B (DFG → DFG 0 min); 15:30 would end 17:30; 19:00–21:00 fits the horizon
    expect(slots.map((s) => s.start.toISOString().slice(11, 16))).toEqual(['14:30', '19:00']);
  });
});
