import { describe, expect, it } from 'vitest';
import { analyseAutocorrelation } from './autocorrelation';
import { assertPhysicalPulse, opticalCycleFs } from './pulse-limits';
import { interferometricTrace } from './test-traces';

const engineError = (code: string, details: Record<string, unknown>) => expect.objectContaining({ code, details: expect.objectContaining(details) });

describe('pulse plausibility', () => {
  it('when the centre is 800 nm, then one optical cycle is 2.6685 fs', () => {
    // Source: T = λ/c with c = 299 792 458 m/s exact (CODATA 2018): 800e-9 / 299792458 = 2.66851e-15 s
    expect(opticalCycleFs(800)).toBeCloseTo(2.66851, 5);
    // 1550 nm: 5.17024 fs (same relation)
    expect(opticalCycleFs(1550)).toBeCloseTo(5.17024, 5);
  });

  it('when a fringe-resolved trace of a 30 fs pulse at 800 nm is read as an intensity AC, then it yields under 1 fs and is refused below one cycle', () => {
    const trace = interferometricTrace(30, 800);
    // Source: the 8 : 1 peak-to-background ratio of an interferometric AC (Diels & Rudolph)
    const peak = trace.reduce((m, p) => Math.max(m, p[1]), 0);
    expect(peak / trace[0]![1]).toBeCloseTo(8, 1);
    const naive = analyseAutocorrelation(trace, 'gaussian');
    expect(naive.pulseFwhmFs).toBeLessThan(1);
    expect(() => assertPhysicalPulse({ pulseFwhmFs: naive.pulseFwhmFs, centreNm: 800, shape: 'gaussian' }))
      .toThrow(engineError('below_optical_cycle', { centreNm: 800, opticalCycleFs: expect.closeTo(2.6685, 3) }));
  });

  it('when the spectrum is 10 nm at 800 nm, then 90 fs Gaussian is refused below the 94.2 fs limit and 95 fs passes', () => {
    // Source: TBP 2 ln2/π = 0.4413 (Gaussian), Δν = cΔλ/λ² = 4.6843 THz — Diels & Rudolph; hand-computed 0.4413 / 4.6843 THz = 94.20 fs
    expect(() => assertPhysicalPulse({ pulseFwhmFs: 90, centreNm: 800, spectralFwhmNm: 10, shape: 'gaussian' }))
      .toThrow(engineError('below_transform_limit', { transformLimitedFs: expect.closeTo(94.2, 1), timeBandwidthProduct: expect.closeTo(0.441, 3) }));
    expect(() => assertPhysicalPulse({ pulseFwhmFs: 95, centreNm: 800, spectralFwhmNm: 10, shape: 'gaussian' })).not.toThrow();
  });

  it('when the same 70 fs pulse is sech², then it passes its 67.2 fs limit (TBP 0.315) though a Gaussian of 70 fs would not', () => {
    // Source: TBP 0.315 (sech²), Diels & Rudolph: 0.315 / 4.684 THz = 67.2 fs
    expect(() => assertPhysicalPulse({ pulseFwhmFs: 70, centreNm: 800, spectralFwhmNm: 10, shape: 'sech2' })).not.toThrow();
    expect(() => assertPhysicalPulse({ pulseFwhmFs: 70, centreNm: 800, spectralFwhmNm: 10, shape: 'gaussian' })).toThrow(engineError('below_transform_limit', {}));
  });
});
