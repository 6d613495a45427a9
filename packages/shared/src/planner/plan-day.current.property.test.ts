import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ChangeoverModelInput, SourceState } from '../changeover/changeover-model';
import { checkTimeline } from '../timeline/timeline-check';
import { planDay } from './plan-day';
import type { PlanDayInput } from './plan-schemas';

const DAY_START = Date.UTC(2030, 2, 4, 8, 0);
const DAY_MINUTES = 600;
const iso = (minutes: number) => new Date(DAY_START + minutes * 60_000).toISOString();
const states: SourceState[] = [
  { configurationKey: 'opa_signal', nm: 1300 },
  { configurationKey: 'opa_signal', nm: 1310 },
  { configurationKey: 'dfg', nm: 4000 },
  { configurationKey: 'fundamental', nm: 800 },
];
const model: ChangeoverModelInput = {
  pairs: [
    { from: 'opa_signal', to: 'dfg', baseMinutes: 50 },
    { from: 'dfg', to: 'opa_signal', baseMinutes: 45 },
    { from: 'fundamental', to: 'dfg', baseMinutes: 55 },
    { from: 'dfg', to: 'fundamental', baseMinutes: 55 },
  ],
  retuneMinutesPerNm: 0.1,
  warmupAfterMaintenanceMinutes: 30,
  pulseCheckMinutes: 5,
  defaultBaseMinutes: 20,
};

/**
 * A day as it stands: bookings laid out one after another with at least the changeover between them (found with
 * checkTimeline against what is already laid out), each allowed to move by `flex` minutes within the day.
 */
const dayArbitrary = fc
  .record({
    bookings: fc.array(
      fc.record({ duration: fc.constantFrom(60, 90, 120), state: fc.constantFrom(...states), pause: fc.integer({ min: 0, max: 60 }) }),
      { maxLength: 6 },
    ),
    flex: fc.constantFrom(0, 30, 120, 240),
    firstAt: fc.integer({ min: 0, max: 90 }),
  })
  .map((raw) => {
    const laid: Array<{ id: string; kind: 'booking'; start: string; end: string; state: SourceState }> = [];
    let at = raw.firstAt;
    for (const [i, b] of raw.bookings.entries()) {
      const probe = checkTimeline(laid, { start: iso(at), end: iso(at + b.duration), state: b.state }, { model });
      const start = (new Date(probe.earliestStart!).getTime() - DAY_START) / 60_000 + b.pause;
      if (start + b.duration > DAY_MINUTES) break;
      laid.push({ id: `b${i}`, kind: 'booking', start: iso(start), end: iso(start + b.duration), state: b.state });
      at = start + b.duration;
    }
    const minutes = (s: string) => (new Date(s).getTime() - DAY_START) / 60_000;
    const input: PlanDayInput = {
      dayStart: iso(0),
      dayEnd: iso(DAY_MINUTES),
      fixedBlocks: [],
      requests: laid.map((b, i) => ({
        id: b.id,
        durationMinutes: minutes(b.end) - minutes(b.start),
        state: b.state,
        earliestStart: iso(Math.max(0, minutes(b.start) - raw.flex)),
        latestEnd: iso(Math.min(DAY_MINUTES, minutes(b.end) + raw.flex)),
        currentStart: b.start,
        submittedAt: new Date(DAY_START - (i + 1) * 60_000).toISOString(),
      })),
      model,
    };
    return { input, laid };
  });

function changeoverOf(blocks: Array<{ start: string | Date; end: string | Date; state: SourceState }>): number {
  const sorted = [...blocks].sort((a, b) => new Date(a.start).getTime() - new Date(b.start).getTime());
  let total = 0;
  for (let i = 1; i < sorted.length; i += 1) {
    const c = checkTimeline([{ id: 'p', kind: 'booking', start: sorted[i - 1]!.start, end: sorted[i - 1]!.end, state: sorted[i - 1]!.state }], { start: sorted[i]!.start, end: sorted[i]!.end, state: sorted[i]!.state }, { model });
    total += c.before?.neededMinutes ?? 0;
  }
  return total;
}

describe('day planner against the day as it stands', () => {
  it('when a plan moves any booking, then it strictly lowers the changeover; otherwise every booking stays where it is', () => {
    fc.assert(
      fc.property(dayArbitrary, fc.boolean(), ({ input, laid }, heuristic) => {
        const plan = planDay(input, heuristic ? { exactLimit: 0, seed: 5 } : {});
        const current = changeoverOf(laid);
        expect(plan.currentChangeoverMinutes).toBeCloseTo(current, 6);
        expect(plan.order).toHaveLength(laid.length);
        const moved = plan.order.filter((o) => o.start.toISOString() !== laid.find((b) => b.id === o.id)!.start);
        if (moved.length > 0) {
          const after = changeoverOf(plan.order.map((o) => ({ start: o.start, end: o.end, state: laid.find((b) => b.id === o.id)!.state })));
          expect(after).toBeLessThan(current - 1e-9);
          expect(plan.savedMinutes).toBeGreaterThan(0);
        } else {
          expect(plan.savedMinutes).toBe(0);
        }
        for (const o of plan.order) {
          const r = input.requests.find((x) => x.id === o.id)!;
          expect(o.start.getTime()).toBeGreaterThanOrEqual(new Date(r.earliestStart!).getTime());
          expect(o.end.getTime()).toBeLessThanOrEqual(new Date(r.latestEnd!).getTime());
        }
      }),
      { numRuns: 150, seed: 1212 },
    );
  });

  it('when every booking has the same configuration and wavelength, then nothing moves whatever the flex', () => {
    const state = { configurationKey: 'opa_signal', nm: 1300 };
    const input: PlanDayInput = {
      dayStart: iso(0),
      dayEnd: iso(DAY_MINUTES),
      requests: [0, 1, 2].map((i) => ({
        id: `s${i}`, durationMinutes: 120, state, earliestStart: iso(120 + i * 180 - 120), latestEnd: iso(Math.min(DAY_MINUTES, 120 + i * 180 + 240)),
        currentStart: iso(120 + i * 180), submittedAt: iso(-10 + i),
      })),
      model,
    };
    const plan = planDay(input);
    expect(plan.order.map((o) => o.start.toISOString())).toEqual([iso(120), iso(300), iso(480)]);
    expect(plan.savedMinutes).toBe(0);
  });
});
