import { describe, expect, it } from 'vitest';
import { checkTargetFeasibility } from './feasibility';
import { demoConfigurations } from './demo-configurations';
import { idlerFromPumpAndSignal, opaForDfgTarget, signalFromPumpAndIdler } from './mixing';

const signal = { outputKind: 'opa_signal' as const, minNm: 1150, maxNm: 1600 };
const byKey = (key: string) => {
  const c = demoConfigurations.find((x) => x.key === key);
  if (!c) throw new Error(`missing ${key}`);
  return c;
};

describe('target feasibility', () => {
  it('when a target lies outside the tuning range, then it is refused with the range in the message', () => {
    const result = checkTargetFeasibility({ targetNm: 1700 }, signal);
    expect(result.feasible).toBe(false);
    expect(result.reasons[0]).toEqual({
      code: 'out_of_range',
      message: "Target 1700 nm is outside OPA signal's tuning range 1150–1600 nm",
    });
    // 1700 nm is also past degeneracy for an 800 nm pump, so the physics refuses it too
    expect(result.reasons.map((r) => r.code)).toEqual(['out_of_range', 'unreachable']);
  });

  it('when a target lies inside, then it is feasible with the idler and DFG derived', () => {
    const result = checkTargetFeasibility({ targetNm: 1300 }, signal);
    expect(result.feasible).toBe(true);
    // Source: energy conservation (Boyd, Nonlinear Optics)
    expect(result.derived.idler?.minNm).toBeCloseTo(2080, 6);
    expect(result.onTable.map((b) => b.role)).toEqual(['pump_residual', 'signal', 'idler']);
  });

  it('when a range is inverted or reaches outside, then inverted_range or out_of_range is given', () => {
    expect(checkTargetFeasibility({ minNm: 1400, maxNm: 1300 }, signal).reasons[0]?.code).toBe('inverted_range');
    const partly = checkTargetFeasibility({ minNm: 1500, maxNm: 1700 }, signal);
    expect(partly.reasons[0]?.message).toBe("Range 1500–1700 nm extends outside OPA signal's tuning range 1150–1600 nm");
  });

  it('when a target is not positive, then invalid_wavelengths is given and nothing is derived', () => {
    const result = checkTargetFeasibility({ targetNm: -3 }, signal);
    expect(result.reasons.map((r) => r.code)).toEqual(['invalid_wavelengths']);
    expect(result.onTable).toEqual([]);
  });

  it('when a signal target lies beyond degeneracy, then it is also unreachable by the physics', () => {
    const result = checkTargetFeasibility({ targetNm: 1700 }, { ...signal, maxNm: 1800 });
    expect(result.reasons.map((r) => r.code)).toEqual(['unreachable']);
  });
});

describe('demo configurations against facts of the trade', () => {
  it('when the fundamental range is checked, then it lies within the Ti:sapphire tuning range', () => {
    const f = byKey('fundamental');
    // Source: Moulton, JOSA B 3, 125 (1986), Ti:Al2O3 tunes 660–986 nm; "roughly 750–900 nm" is common practice
    expect(f.minNm).toBeGreaterThanOrEqual(660);
    expect(f.maxNm).toBeLessThanOrEqual(986);
  });

  it('when an 800 nm pumped OPA gives ~1.3 µm signal, then the idler is near 2 µm (2.08 µm)', () => {
    // Common practice (trade fact); the exact figure from energy conservation (Boyd, Nonlinear Optics)
    expect(idlerFromPumpAndSignal(800, 1300) / 1000).toBeCloseTo(2.08, 6);
  });

  it('when the idler range is mapped to signal partners at 800 nm, then they lie within the signal range', () => {
    const s = byKey('opa_signal');
    const i = byKey('opa_idler');
    // Source: energy conservation (Boyd, Nonlinear Optics)
    for (const idlerNm of [i.minNm, (i.minNm + i.maxNm) / 2, i.maxNm]) {
      const partner = signalFromPumpAndIdler(800, idlerNm);
      expect(partner).toBeGreaterThanOrEqual(s.minNm);
      expect(partner).toBeLessThanOrEqual(s.maxNm + 1e-9);
    }
  });

  it('when the DFG range is mapped to signal and idler at 800 nm, then both lie in their ranges', () => {
    const s = byKey('opa_signal');
    const i = byKey('opa_idler');
    const d = byKey('dfg');
    // Source: 1/λDFG = 1/λs − 1/λi with 1/λp = 1/λs + 1/λi (Boyd, Nonlinear Optics)
    for (const dfgNm of [d.minNm, 5000, d.maxNm]) {
      const mix = opaForDfgTarget(800, dfgNm);
      expect(mix.signalNm).toBeGreaterThanOrEqual(s.minNm);
      expect(mix.signalNm).toBeLessThanOrEqual(s.maxNm);
      expect(mix.idlerNm).toBeGreaterThanOrEqual(i.minNm);
      expect(mix.idlerNm).toBeLessThanOrEqual(i.maxNm);
    }
  });

  it('when SHG range is halved from the fundamental range, then they agree', () => {
    // Source: SHG halves the wavelength (Boyd, Nonlinear Optics)
    expect(byKey('shg').minNm * 2).toBe(byKey('fundamental').minNm);
    expect(byKey('shg').maxNm * 2).toBe(byKey('fundamental').maxNm);
  });

  it('when each default wavelength is checked, then it is feasible in its own configuration', () => {
    for (const c of demoConfigurations) {
      expect(checkTargetFeasibility({ targetNm: c.defaultNm }, c).feasible).toBe(true);
    }
  });
});
