import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changeoverMinutes, type ChangeoverModelInput, type SourceState } from '../changeover/changeover-model';
import { checkTimeline } from '../timeline/timeline-check';
import { planDay } from './plan-day';
import type { PlanDayInput } from './plan-schemas';

const DAY_START = Date.UTC(2030, 2, 4, 8, 0);
const DAY_MINUTES = 360;
const iso = (minutes: number) => new Date(DAY_START + minutes * 60_000).toISOString();
const states: SourceState[] = [
  { configurationKey: 'opa_signal', nm: 1300 },
  { configurationKey: 'opa_signal', nm: 1500 },
  { configurationKey: 'opa_idler', nm: 2080 },
  { configurationKey: 'dfg', nm: 4000 },
];

interface Instance {
  input: PlanDayInput;
  requests: Array<{ id: string; duration: number; state: SourceState; earliest: number; latest: number }>;
  fixed: Array<{ kind: 'booking' | 'maintenance'; start: number; end: number; state: SourceState | null }>;
  initial: SourceState | null;
  model: ChangeoverModelInput;
}

const instanceArbitrary = (maxRequests: number) =>
  fc
    .record({
      requests: fc.array(
        fc.record({
          duration: fc.constantFrom(45, 60, 90, 120),
          state: fc.constantFrom(...states),
          earliest: fc.integer({ min: 0, max: 300 }),
          slack: fc.integer({ min: -20, max: 360 }),
          submitted: fc.integer({ min: 0, max: 1000 }),
        }),
        { maxLength: maxRequests },
      ),
      fixed: fc.array(
        fc.record({
          kind: fc.constantFrom('booking' as const, 'maintenance' as const),
          length: fc.constantFrom(30, 60),
          state: fc.constantFrom(...states),
        }),
        { maxLength: 2 },
      ),
      fixedStarts: fc.uniqueArray(fc.integer({ min: 0, max: 11 }), { minLength: 2, maxLength: 2 }),
      initial: fc.option(fc.constantFrom(...states), { nil: null }),
      signalToDfg: fc.integer({ min: 0, max: 60 }),
      dfgToSignal: fc.integer({ min: 0, max: 60 }),
      perNm: fc.constantFrom(0, 0.05, 0.2),
      warmup: fc.constantFrom(0, 20, 45),
      pulseCheck: fc.constantFrom(0, 5),
    })
    .map((raw): Instance => {
      const model: ChangeoverModelInput = {
        pairs: [
          { from: 'opa_signal', to: 'dfg', baseMinutes: raw.signalToDfg },
          { from: 'dfg', to: 'opa_signal', baseMinutes: raw.dfgToSignal },
          { from: 'opa_signal', to: 'opa_idler', baseMinutes: 10 },
        ],
        retuneMinutesPerNm: raw.perNm,
        warmupAfterMaintenanceMinutes: raw.warmup,
        pulseCheckMinutes: raw.pulseCheck,
        defaultBaseMinutes: 30,
      };
      const starts = [...raw.fixedStarts].sort((a, b) => a - b).map((s) => s * 30);
      const fixed = raw.fixed.map((f, i) => ({
        kind: f.kind,
        start: starts[i],
        end: starts[i] + f.length,
        state: f.kind === 'booking' ? f.state : null,
      }));
      const requests = raw.requests.map((r, i) => ({
        id: `r${i}`,
        duration: r.duration,
        state: r.state,
        earliest: r.earliest,
        latest: Math.min(DAY_MINUTES, r.earliest + r.duration + r.slack),
      }));
      const input: PlanDayInput = {
        dayStart: iso(0),
        dayEnd: iso(DAY_MINUTES),
        fixedBlocks: fixed.map((f, i) => ({ id: `f${i}`, kind: f.kind, start: iso(f.start), end: iso(f.end), state: f.state })),
        requests: requests.map((r, i) => ({
          id: r.id,
          durationMinutes: r.duration,
          state: r.state,
          earliestStart: iso(r.earliest),
          latestEnd: iso(r.latest),
          submittedAt: new Date(DAY_START - raw.requests[i].submitted * 60_000).toISOString(),
        })),
        model,
        initialState: raw.initial,
      };
      return { input, requests, fixed, initial: raw.initial, model };
    });

/**
 * Brute force written apart from the planner: every chronological sequence of requests, each
 * tagged with the gap between fixed blocks it sits in, each request at its earliest start.
 * Returns the best (count, changeover) over all of them.
 */
function bruteForce(instance: Instance): { count: number; cost: number } {
  const { requests, fixed, initial, model } = instance;
  type Left = { end: number; state: SourceState | null; maintenance: boolean };
  type Right = { start: number; state: SourceState | null };
  const lefts: Left[] = [{ end: 0, state: initial, maintenance: false }, ...fixed.map((f) => ({ end: f.end, state: f.state, maintenance: f.kind === 'maintenance' }))];
  const rights: Right[] = [...fixed.map((f) => ({ start: f.start, state: f.state })), { start: DAY_MINUTES, state: null }];
  const into = (from: Left, to: SourceState) => changeoverMinutes(from.maintenance ? null : from.state, to, model, { afterMaintenance: from.maintenance }).totalMinutes;
  const outOf = (from: SourceState, right: Right) => (right.state ? changeoverMinutes(from, right.state, model).totalMinutes : 0);
  const emptyGap = (g: number) => (rights[g].state ? into(lefts[g], rights[g].state as SourceState) : 0);
  let best = { count: -1, cost: Number.POSITIVE_INFINITY };
  const used = new Array(requests.length).fill(false);

  // cost so far counts every transition up to the last request; the current gap is still open.
  const visit = (gap: number, last: number, lastEnd: number, count: number, cost: number) => {
    const closing = last < 0 ? emptyGap(gap) : outOf(requests[last].state, rights[gap]);
    const closable = last < 0 || lastEnd + closing <= rights[gap].start;
    if (closable) {
      let total = cost + closing;
      for (let g = gap + 1; g < lefts.length; g += 1) total += emptyGap(g);
      if (count > best.count || (count === best.count && total < best.cost)) best = { count, cost: total };
    }
    for (let j = 0; j < requests.length; j += 1) {
      if (used[j]) continue;
      const r = requests[j];
      for (let g = gap; g < lefts.length; g += 1) {
        if (g > gap && !closable) break;
        let entryCost = 0;
        let ready: number;
        let before: number;
        if (g === gap && last >= 0) {
          before = changeoverMinutes(requests[last].state, r.state, model).totalMinutes;
          ready = lastEnd + before;
        } else {
          if (g > gap) {
            entryCost += closing;
            for (let k = gap + 1; k < g; k += 1) entryCost += emptyGap(k);
          }
          before = into(lefts[g], r.state);
          ready = lefts[g].end + before;
        }
        const start = Math.max(r.earliest, ready);
        const end = start + r.duration;
        if (end > r.latest || end > rights[g].start) continue;
        used[j] = true;
        visit(g, j, end, count + 1, cost + entryCost + before);
        used[j] = false;
      }
    }
  };
  visit(0, -1, 0, 0, 0);
  return best;
}

function expectValid(instance: Instance, plan: ReturnType<typeof planDay>) {
  const ids = [...plan.order.map((o) => o.id), ...plan.unplaced.map((u) => u.id)].sort();
  expect(ids).toEqual(instance.requests.map((r) => r.id).sort());
  const blocks = [
    ...(instance.input.fixedBlocks ?? []),
    ...plan.order.map((o) => ({ id: o.id, kind: 'booking' as const, start: o.start, end: o.end, state: instance.requests.find((r) => r.id === o.id)?.state })),
  ];
  if (instance.initial) blocks.push({ id: 'initial', kind: 'booking', start: iso(-1), end: iso(0), state: instance.initial });
  for (const o of plan.order) {
    const r = instance.requests.find((x) => x.id === o.id);
    if (!r) throw new Error('unknown id');
    expect(o.start.getTime()).toBeGreaterThanOrEqual(DAY_START + r.earliest * 60_000);
    expect(o.end.getTime()).toBeLessThanOrEqual(DAY_START + r.latest * 60_000);
    expect(o.end.getTime() - o.start.getTime()).toBe(r.duration * 60_000);
    const check = checkTimeline(blocks, { id: o.id, start: o.start, end: o.end, state: r.state }, { model: instance.model });
    expect(check.overlaps).toEqual([]);
    expect(check.ok).toBe(true);
  }
}

describe('day planner properties', () => {
  it('when n ≤ 8, then the exact plan equals brute force on count first, then changeover', () => {
    fc.assert(
      fc.property(instanceArbitrary(8), (instance) => {
        const plan = planDay(instance.input);
        const best = bruteForce(instance);
        expect(plan.method).toBe('exact');
        expect(plan.order.length).toBe(best.count);
        expect(plan.changeoverMinutes).toBeCloseTo(best.cost, 6);
      }),
      { numRuns: 60, seed: 20300304 },
    );
  });

  it('when any plan is made, then windows hold, fixed blocks are never overlapped and changeover fits', () => {
    fc.assert(
      fc.property(instanceArbitrary(8), fc.boolean(), (instance, heuristic) => {
        const plan = planDay(instance.input, heuristic ? { exactLimit: 0, seed: 3 } : {});
        expectValid(instance, plan);
      }),
      { numRuns: 80, seed: 4 },
    );
  });

  it('when the heuristic runs on small instances, then it never beats the exact plan', () => {
    fc.assert(
      fc.property(instanceArbitrary(7), (instance) => {
        const exact = planDay(instance.input);
        const heuristic = planDay(instance.input, { exactLimit: 0 });
        expect(heuristic.order.length).toBeLessThanOrEqual(exact.order.length);
        if (heuristic.order.length === exact.order.length) {
          expect(heuristic.changeoverMinutes).toBeGreaterThanOrEqual(exact.changeoverMinutes - 1e-6);
        }
      }),
      { numRuns: 40, seed: 11 },
    );
  });
});
