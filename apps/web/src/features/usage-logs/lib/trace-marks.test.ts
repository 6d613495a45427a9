import { analyseAutocorrelation, autocorrelationFactors } from '@femtoslot/shared';
import { describe, expect, it } from 'vitest';
import { halfMaximumMarks, traceChartPoints } from './trace-marks';

/** An intensity autocorrelation of Gaussian shape, on a baseline, sampled every `step` fs. */
function gaussianTrace(fwhmFs: number, centreFs: number, baseline: number, step = 2, span = 1000): Array<[number, number]> {
  // Source: a Gaussian's FWHM = 2√(2 ln 2)·σ (standard result)
  const sigma = fwhmFs / (2 * Math.sqrt(2 * Math.LN2));
  const points: Array<[number, number]> = [];
  for (let t = -span; t <= span; t += step) points.push([t + centreFs, baseline + Math.exp(-((t * t) / (2 * sigma * sigma)))]);
  return points;
}

describe('half-maximum marks on an autocorrelation trace', () => {
  it('when a Gaussian trace of 150 fs FWHM is analysed, then the crossings sit at centre ± FWHM/2 within 1 %', () => {
    const fwhm = 150;
    const centre = 40;
    const points = gaussianTrace(fwhm, centre, 0.05);
    const result = analyseAutocorrelation(points, 'gaussian');
    const marks = halfMaximumMarks(points, result)!;
    // Source: Gaussian FWHM = 2√(2 ln 2)·σ ⇒ half maximum at ±FWHM/2 from the centre
    expect(Math.abs(marks.leftDelayFs - (centre - fwhm / 2)) / (fwhm / 2)).toBeLessThan(0.01);
    expect(Math.abs(marks.rightDelayFs - (centre + fwhm / 2)) / (fwhm / 2)).toBeLessThan(0.01);
    expect(Math.abs(marks.level - (0.05 + 0.5)) / 0.5).toBeLessThan(0.01);
    // the marks are the width the engine reports
    expect(marks.rightDelayFs - marks.leftDelayFs).toBeCloseTo(result.autocorrelationFwhmFs, 6);
  });

  it('when the trace is Gaussian, then the pulse FWHM is the AC FWHM ÷ √2', () => {
    // Source: Diels & Rudolph, Ultrashort Laser Pulse Phenomena — Gaussian intensity AC deconvolution factor √2
    const points = gaussianTrace(141.42, 0, 0);
    const result = analyseAutocorrelation(points, 'gaussian');
    expect(autocorrelationFactors.gaussian).toBeCloseTo(Math.SQRT2, 12);
    expect(Math.abs(result.pulseFwhmFs - 100) / 100).toBeLessThan(0.01);
  });

  it('when points come out of order, then the chart gets them in delay order and thinned to the limit', () => {
    const points: Array<[number, number]> = [[3, 1], [1, 2], [2, 3]];
    expect(traceChartPoints(points).map((p) => p.delayFs)).toEqual([1, 2, 3]);
    const long = gaussianTrace(100, 0, 0, 0.1, 500);
    const thinned = traceChartPoints(long, 500);
    expect(thinned.length).toBeLessThanOrEqual(502);
    expect(thinned.at(-1)!.delayFs).toBe(long.at(-1)![0]);
  });
});
