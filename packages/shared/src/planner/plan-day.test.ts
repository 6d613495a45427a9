import { describe, expect, it } from 'vitest';
import type { ChangeoverModelInput } from '../changeover/changeover-model';
import { planDay } from './plan-day';

const model: ChangeoverModelInput = {
  pairs: [
    { from: 'opa_signal', to: 'dfg', baseMinutes: 45 },
    { from: 'opa_signal', to: 'opa_idler', baseMinutes: 10 },
  ],
  retuneMinutesPerNm: 0,
  warmupAfterMaintenanceMinutes: 30,
  pulseCheckMinutes: 0,
  defaultBaseMinutes: 45,
};
const at = (hhmm: string) => `2030-03-04T${hhmm}:00Z`;
const signal = { configurationKey: 'opa_signal', nm: 1300 };
const dfg = { configurationKey: 'dfg', nm: 4000 };
const request = (id: string, state: typeof signal, submitted: string, extra: Record<string, string> = {}) => ({
  id,
  durationMinutes: 60,
  state,
  submittedAt: `2030-03-01T${submitted}:00Z`,
  ...extra,
});

describe('day planner', () => {
  it('when signal and DFG requests alternate by submission, then grouping them saves two swaps', () => {
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('20:00'),
      requests: [request('s1', signal, '09:00'), request('d1', dfg, '09:01'), request('s2', signal, '09:02'), request('d2', dfg, '09:03')],
      model,
      initialState: signal,
    });
    // Hand-computed: grouped s s d d needs one 45-min swap; first-come s d s d needs three (135)
    expect(plan.changeoverMinutes).toBe(45);
    expect(plan.firstCome).toEqual({ placedCount: 4, changeoverMinutes: 135 });
    expect(plan.savedMinutes).toBe(90);
    expect(plan.method).toBe('exact');
    expect(plan.provenOptimal).toBe(true);
    expect(plan.order.map((o) => o.changeoverBeforeMinutes)).toEqual([0, 0, 45, 0]);
  });

  it('when waiting until after a fixed DFG booking saves changeover, then the plan waits instead of starting early', () => {
    const directed: ChangeoverModelInput = {
      ...model,
      pairs: [
        { from: 'opa_signal', to: 'dfg', baseMinutes: 45 },
        { from: 'dfg', to: 'opa_signal', baseMinutes: 20 },
      ],
    };
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('14:00'),
      fixedBlocks: [{ id: 'fixed-dfg', kind: 'booking', start: at('10:00'), end: at('11:00'), state: dfg }],
      requests: [request('s1', signal, '09:00')],
      model: directed,
    });
    // Hand-computed: at 08:00 it costs signal → DFG 45 before the fixed booking; after it, DFG → signal 20 ⇒ 11:20
    expect(plan.order).toEqual([{ id: 's1', start: new Date(at('11:20')), end: new Date(at('12:20')), changeoverBeforeMinutes: 20 }]);
    expect(plan.changeoverMinutes).toBe(20);
  });

  it('when a request is a signal one and the fixed booking DFG, then it goes before, not between two swaps', () => {
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('14:00'),
      fixedBlocks: [{ id: 'fixed-dfg', kind: 'booking', start: at('10:00'), end: at('11:00'), state: dfg }],
      requests: [request('s1', signal, '09:00', { earliestStart: at('08:00') })],
      model,
      initialState: signal,
    });
    // Hand-computed: 08:00–09:00 then 45 to the DFG booking at 10:00 gives 45 in all; after it would be 45 + 45
    expect(plan.order).toEqual([{ id: 's1', start: new Date(at('08:00')), end: new Date(at('09:00')), changeoverBeforeMinutes: 0 }]);
    expect(plan.changeoverMinutes).toBe(45);
  });

  it('when a request follows maintenance, then the warm-up is respected and counted', () => {
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('12:00'),
      fixedBlocks: [{ id: 'm', kind: 'maintenance', start: at('08:00'), end: at('10:00') }],
      requests: [request('s1', signal, '09:00')],
      model,
    });
    // Hand-computed: maintenance ends 10:00, warm-up 30 ⇒ 10:30–11:30
    expect(plan.order[0]).toEqual({ id: 's1', start: new Date(at('10:30')), end: new Date(at('11:30')), changeoverBeforeMinutes: 30 });
  });

  it('when requests cannot all fit, then the unplaced are reported with a reason, never dropped', () => {
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('10:00'),
      fixedBlocks: [{ id: 'm', kind: 'maintenance', start: at('09:00'), end: at('10:00') }],
      requests: [
        request('a', signal, '09:00'),
        request('b', signal, '09:01'),
        request('narrow', signal, '09:02', { earliestStart: at('08:30'), latestEnd: at('09:00') }),
      ],
      model,
    });
    // Hand-computed: only one hour before maintenance; 'narrow' has a 30-minute window for 60 minutes
    expect(plan.order).toHaveLength(1);
    expect(plan.unplaced.map((u) => [u.id, u.reason]).sort()).toEqual(
      [[plan.order[0].id === 'a' ? 'b' : 'a', 'crowded_out'], ['narrow', 'window_too_short']].sort(),
    );
  });

  it('when a request only fits across a maintenance block, then it is no_room', () => {
    const plan = planDay({
      dayStart: at('08:00'),
      dayEnd: at('11:00'),
      fixedBlocks: [{ id: 'm', kind: 'maintenance', start: at('09:00'), end: at('10:00') }],
      requests: [{ ...request('long', signal, '09:00'), durationMinutes: 90 }],
      model,
    });
    expect(plan.unplaced).toEqual([expect.objectContaining({ id: 'long', reason: 'no_room' })]);
  });

  it('when above the exact limit, then the heuristic answers, does not claim proof, and is deterministic per seed', () => {
    const requests = Array.from({ length: 12 }, (_, i) => request(`r${i}`, i % 3 ? signal : dfg, `09:${String(i).padStart(2, '0')}`));
    const input = { dayStart: at('06:00'), dayEnd: at('23:00'), requests, model };
    const first = planDay(input, { seed: 5 });
    const again = planDay(input, { seed: 5 });
    expect(first.method).toBe('heuristic');
    expect(first.provenOptimal).toBe(false);
    expect(again).toEqual(first);
    expect(first.order.length + first.unplaced.length).toBe(12);
  });
});
