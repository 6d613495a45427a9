import { describe, expect, it } from 'vitest';
import { changeoverMinutes, changeoverModelSchema, type ChangeoverModelInput } from './changeover-model';
import { defaultChangeoverModel } from './default-changeover-model';

const model: ChangeoverModelInput = {
  pairs: [
    { from: 'opa_signal', to: 'dfg', baseMinutes: 45 },
    { from: 'dfg', to: 'opa_signal', baseMinutes: 40 },
    { from: 'fundamental', to: 'shg', baseMinutes: 15 },
  ],
  retuneMinutesPerNm: 0.05,
  warmupAfterMaintenanceMinutes: 30,
  pulseCheckMinutes: 5,
  defaultBaseMinutes: 25,
};

describe('changeover minutes', () => {
  it('when retuning 1300 → 1450 nm in one output at 0.05 min/nm, then 7.5 rounds up to 8 + 5 pulse check', () => {
    const result = changeoverMinutes({ configurationKey: 'opa_signal', nm: 1300 }, { configurationKey: 'opa_signal', nm: 1450 }, model);
    // Hand-computed: 150 nm × 0.05 = 7.5 → 8 minutes; + 5 pulse check = 13
    expect(result).toEqual({ totalMinutes: 13, breakdown: { baseMinutes: 0, retuneMinutes: 8, warmupMinutes: 0, pulseCheckMinutes: 5 } });
  });

  it('when the retune product is whole but inexact in floating point, then it is not rounded up a minute', () => {
    const result = changeoverMinutes({ configurationKey: 'opa_signal', nm: 1300 }, { configurationKey: 'opa_signal', nm: 1500 }, model);
    // Hand-computed: 200 nm × 0.05 = 10 minutes exactly
    expect(result.breakdown.retuneMinutes).toBe(10);
  });

  it('when the state is unchanged, then no changeover and no pulse check are needed', () => {
    const state = { configurationKey: 'dfg', nm: 4000 };
    expect(changeoverMinutes(state, state, model).totalMinutes).toBe(0);
  });

  it('when the configuration changes, then the pair base applies, directed first and reverse as fallback', () => {
    const signal = { configurationKey: 'opa_signal', nm: 1300 };
    const dfg = { configurationKey: 'dfg', nm: 4000 };
    const shg = { configurationKey: 'shg', nm: 400 };
    const fundamental = { configurationKey: 'fundamental', nm: 800 };
    expect(changeoverMinutes(signal, dfg, model).breakdown.baseMinutes).toBe(45);
    expect(changeoverMinutes(dfg, signal, model).breakdown.baseMinutes).toBe(40);
    expect(changeoverMinutes(shg, fundamental, model).breakdown.baseMinutes).toBe(15);
    expect(changeoverMinutes(shg, dfg, model).breakdown.baseMinutes).toBe(25);
  });

  it('when the previous block was maintenance, then the warm-up is added', () => {
    const result = changeoverMinutes(null, { configurationKey: 'shg', nm: 400 }, model, { afterMaintenance: true });
    // Hand-computed: 30 warm-up + 5 pulse check
    expect(result).toEqual({ totalMinutes: 35, breakdown: { baseMinutes: 0, retuneMinutes: 0, warmupMinutes: 30, pulseCheckMinutes: 5 } });
  });

  it('when nothing is known before, then the first booking needs no changeover', () => {
    expect(changeoverMinutes(null, { configurationKey: 'shg', nm: 400 }, model).totalMinutes).toBe(0);
  });

  it('when a model lists a pair twice or a negative figure, then it is refused', () => {
    expect(changeoverModelSchema.safeParse({ ...model, pairs: [...model.pairs, model.pairs[0]] }).success).toBe(false);
    expect(changeoverModelSchema.safeParse({ ...model, retuneMinutesPerNm: -1 }).success).toBe(false);
    expect(() => changeoverMinutes(null, { configurationKey: 'shg', nm: 400 }, { ...model, defaultBaseMinutes: -3 })).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });

  it('when the demo defaults are read, then DFG swaps take far longer than re-peaking a signal', () => {
    expect(changeoverModelSchema.safeParse(defaultChangeoverModel).success).toBe(true);
    const swap = changeoverMinutes({ configurationKey: 'opa_signal', nm: 1300 }, { configurationKey: 'dfg', nm: 4000 }, defaultChangeoverModel);
    const repeak = changeoverMinutes({ configurationKey: 'opa_signal', nm: 1300 }, { configurationKey: 'opa_signal', nm: 1350 }, defaultChangeoverModel);
    // Common practice: re-peak within one output in minutes, DFG crystal swap most of an hour
    expect(swap.totalMinutes).toBeGreaterThanOrEqual(40);
    expect(repeak.totalMinutes).toBeLessThanOrEqual(10);
  });
});
