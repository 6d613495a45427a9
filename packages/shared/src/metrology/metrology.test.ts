import { describe, expect, it } from 'vitest';
import { seededRandom } from '../planner/seeded-random';
import { analyseAutocorrelation, autocorrelationFactors, MAX_TRACE_POINTS, type PulseShape } from './autocorrelation';
import { timeBandwidth, transformLimitedDurationFs, transformLimitedProducts } from './time-bandwidth';

const code = (c: string) => expect.objectContaining({ code: c });

/** Normal noise by Box–Muller from a seeded uniform generator. */
function noise(seed: number) {
  const random = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

/** Intensity autocorrelation computed numerically: ∫ I(t) I(t − τ) dt of the pulse shape itself. */
function numericalAutocorrelation(shape: PulseShape, pulseFwhmFs: number, delays: number[]): number[] {
  const intensity =
    shape === 'gaussian'
      ? (t: number) => Math.exp((-4 * Math.LN2 * t * t) / (pulseFwhmFs * pulseFwhmFs))
      : (t: number) => 1 / Math.cosh((2 * Math.log(1 + Math.SQRT2) * t) / pulseFwhmFs) ** 2;
  const step = pulseFwhmFs / 200;
  const span = 12 * pulseFwhmFs;
  return delays.map((tau) => {
    let sum = 0;
    for (let t = -span; t <= span; t += step) sum += intensity(t) * intensity(t - tau);
    return sum * step;
  });
}

function trace(shape: PulseShape, pulseFwhmFs: number, seed: number): Array<[number, number]> {
  const delays = Array.from({ length: 301 }, (_, i) => -8 * pulseFwhmFs + (16 * pulseFwhmFs * i) / 300);
  const ac = numericalAutocorrelation(shape, pulseFwhmFs, delays);
  const peak = Math.max(...ac);
  const gauss = noise(seed);
  return delays.map((d, i) => [d, 0.37 + (2.5 * ac[i]) / peak + 0.004 * gauss()]);
}

describe('autocorrelation analysis', () => {
  it('when the deconvolution factors are read, then they are √2 and 1.543', () => {
    // Source: Diels & Rudolph, Ultrashort Laser Pulse Phenomena, intensity AC / pulse FWHM
    expect(autocorrelationFactors.gaussian).toBeCloseTo(1.41421, 5);
    expect(autocorrelationFactors.sech2).toBeCloseTo(1.543, 3);
  });

  it('when a Gaussian pulse of 85 fs gives a noisy, offset AC trace, then 85 fs comes back within 1 %', () => {
    const result = analyseAutocorrelation(trace('gaussian', 85, 7), 'gaussian');
    // Source: Diels & Rudolph — a Gaussian's intensity AC is a Gaussian √2 wider; trace built by numerical convolution
    expect(Math.abs(result.pulseFwhmFs / 85 - 1)).toBeLessThan(0.01);
    expect(result.baseline).toBeCloseTo(0.37, 2);
  });

  it('when a sech² pulse of 120 fs gives a noisy, offset AC trace, then 120 fs comes back within 1 %', () => {
    const result = analyseAutocorrelation(trace('sech2', 120, 11), 'sech2');
    // Source: Diels & Rudolph / Kärtner, Ultrafast Optics — sech² AC FWHM = 1.543 × pulse FWHM; trace by numerical convolution
    expect(Math.abs(result.pulseFwhmFs / 120 - 1)).toBeLessThan(0.01);
  });

  it('when the sech² trace is read as Gaussian, then the width differs by the factor ratio', () => {
    const points = trace('sech2', 120, 3);
    const asSech = analyseAutocorrelation(points, 'sech2');
    const asGauss = analyseAutocorrelation(points, 'gaussian');
    // Source: Diels & Rudolph factors, 1.5427 / √2
    expect(asGauss.pulseFwhmFs / asSech.pulseFwhmFs).toBeCloseTo(1.5427 / Math.SQRT2, 6);
  });

  it('when a trace has four points, then too_few_points', () => {
    expect(() => analyseAutocorrelation([[0, 1], [1, 2], [2, 3], [3, 4]], 'gaussian')).toThrow(code('too_few_points'));
  });

  it('when a trace is flat, then no_peak', () => {
    const flat: Array<[number, number]> = Array.from({ length: 40 }, (_, i) => [i, 2]);
    expect(() => analyseAutocorrelation(flat, 'gaussian')).toThrow(code('no_peak'));
  });

  it('when 150,000 points are given, then too_many_points names the limit (no stack overflow)', () => {
    const many: Array<[number, number]> = Array.from({ length: 150_000 }, (_, i) => [i, Math.exp(-(((i - 75_000) / 3000) ** 2))]);
    expect(() => analyseAutocorrelation(many, 'gaussian')).toThrow(expect.objectContaining({ code: 'too_many_points', details: expect.objectContaining({ maximum: MAX_TRACE_POINTS, count: 150_000 }) }));
  });

  it('when the scan stops before the trace falls to half maximum, then peak_at_edge', () => {
    const cut = trace('gaussian', 85, 5).filter(([d]) => d > -20);
    expect(() => analyseAutocorrelation(cut, 'gaussian')).toThrow(code('peak_at_edge'));
  });
});

describe('time-bandwidth product', () => {
  it('when the transform-limited products are read, then they are 0.441 and 0.315', () => {
    // Source: Diels & Rudolph; Kärtner, Ultrafast Optics — Gaussian 0.441, sech² 0.315
    expect(transformLimitedProducts.gaussian).toBeCloseTo(0.441, 3);
    expect(transformLimitedProducts.sech2).toBeCloseTo(0.315, 3);
  });

  it('when the spectrum is 10 nm FWHM at 800 nm, then the limit is 94.2 fs (Gaussian) and 67.2 fs (sech²)', () => {
    // Source: Δν = cΔλ/λ² with CODATA c; TBP 0.441 / 0.315 (Diels & Rudolph)
    expect(transformLimitedDurationFs(800, 10, 'gaussian')).toBeCloseTo(94.2, 1);
    expect(transformLimitedDurationFs(800, 10, 'sech2')).toBeCloseTo(67.2, 1);
  });

  it('when a 120 fs sech² pulse has 10 nm at 800 nm, then it is 1.79 × the transform limit', () => {
    const result = timeBandwidth({ pulseFwhmFs: 120, centreNm: 800, spectralFwhmNm: 10, shape: 'sech2' });
    // Hand-computed from Δν = cΔλ/λ² = 4.684 THz: TBP = 120 fs × 4.684 THz = 0.562; 120 / 67.2 = 1.79
    expect(result.timeBandwidthProduct).toBeCloseTo(0.562, 3);
    expect(result.timesTransformLimit).toBeCloseTo(1.785, 2);
  });
});
