import { z } from 'zod';
import { EngineError, parseEngineInput } from '../units/engine-error';

export const pulseShapes = ['gaussian', 'sech2'] as const;
export type PulseShape = (typeof pulseShapes)[number];

/**
 * Intensity-autocorrelation FWHM ÷ pulse FWHM (Diels & Rudolph, Ultrashort Laser Pulse Phenomena):
 * √2 for a Gaussian, 1.5427 for sech².
 */
export const autocorrelationFactors: Record<PulseShape, number> = { gaussian: Math.SQRT2, sech2: 1.5427 };

export const MIN_TRACE_POINTS = 5;
/**
 * The most points one trace may hold: a scanning autocorrelator records a few thousand; 100 000 covers a long
 * oscilloscope record (common practice, not a published limit) and keeps the work per request bounded.
 */
export const MAX_TRACE_POINTS = 100_000;
// Share of the trace at each end that is taken as baseline.
const WING_FRACTION = 0.1;
// A peak less than this many noise σ above the baseline is not told apart from noise.
const PEAK_NOISE_SIGMAS = 5;

export const tracePointSchema = z.tuple([z.number(), z.number()]);
export const autocorrelationInputSchema = z.object({
  points: z.array(tracePointSchema).max(MAX_TRACE_POINTS),
  shape: z.enum(pulseShapes),
});
export type AutocorrelationInput = z.input<typeof autocorrelationInputSchema>;

export interface AutocorrelationResult {
  shape: PulseShape;
  baseline: number;
  peakSignal: number;
  peakDelayFs: number;
  autocorrelationFwhmFs: number;
  pulseFwhmFs: number;
  deconvolutionFactor: number;
  pointCount: number;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** Delay where the trace crosses `level` between samples i and i+1, by linear interpolation. */
function crossing(delays: number[], values: number[], i: number, level: number): number {
  const t = (level - values[i]) / (values[i + 1] - values[i]);
  return delays[i] + t * (delays[i + 1] - delays[i]);
}

/**
 * Peak height from a least-squares parabola through the samples above 80 % of the highest one,
 * so that neither one noisy sample nor coarse sampling sets the half-maximum level.
 */
function peakHeight(delays: number[], values: number[], peakIndex: number): number {
  const top = values[peakIndex];
  let lo = peakIndex;
  let hi = peakIndex;
  while (lo > 0 && values[lo - 1] >= 0.8 * top) lo -= 1;
  while (hi < values.length - 1 && values[hi + 1] >= 0.8 * top) hi += 1;
  if (hi - lo < 2 || !(top > 0)) return top;
  const x0 = delays[peakIndex];
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  for (let i = lo; i <= hi; i += 1) {
    const x = delays[i] - x0;
    const y = values[i];
    s0 += 1; s1 += x; s2 += x * x; s3 += x * x * x; s4 += x * x * x * x;
    t0 += y; t1 += x * y; t2 += x * x * y;
  }
  // Normal equations of y = a + b·x + c·x², solved by Cramer's rule.
  const det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s2 * s3) + s2 * (s1 * s3 - s2 * s2);
  if (Math.abs(det) < 1e-300) return top;
  const a = (t0 * (s2 * s4 - s3 * s3) - s1 * (t1 * s4 - t2 * s3) + s2 * (t1 * s3 - t2 * s2)) / det;
  const b = (s0 * (t1 * s4 - t2 * s3) - t0 * (s1 * s4 - s2 * s3) + s2 * (s1 * t2 - s2 * t1)) / det;
  const c = (s0 * (s2 * t2 - s3 * t1) - s1 * (s1 * t2 - s2 * t1) + t0 * (s1 * s3 - s2 * s2)) / det;
  if (!(c < 0)) return top;
  const vertex = -b / (2 * c);
  if (vertex < delays[lo] - x0 || vertex > delays[hi] - x0) return top;
  const height = a + b * vertex + c * vertex * vertex;
  return Number.isFinite(height) ? height : top;
}

/**
 * Baseline-corrected FWHM of an intensity autocorrelation and the pulse FWHM it implies.
 * Baseline: median of the outer 10 % at the lower end of the scan; peak: a parabola through the
 * top samples; FWHM: linear interpolation at half maximum.
 */
export function analyseAutocorrelation(points: Array<[number, number]>, shape: PulseShape): AutocorrelationResult {
  assertPointCount(Array.isArray(points) ? points.length : 0);
  const input = parseEngineInput(autocorrelationInputSchema, { points, shape });
  return analysePoints(input.points, input.shape);
}

/** Refuses a trace longer than MAX_TRACE_POINTS before any work is spent on it. */
export function assertPointCount(count: number): void {
  if (count > MAX_TRACE_POINTS) {
    throw new EngineError('too_many_points', `A trace may hold at most ${MAX_TRACE_POINTS} points; this one has ${count}`, { count, maximum: MAX_TRACE_POINTS });
  }
}

/** The analysis proper, on points already known to be finite number pairs (no second validation pass). */
export function analysePoints(points: Array<[number, number]>, shape: PulseShape): AutocorrelationResult {
  assertPointCount(points.length);
  const input = { points, shape };
  if (input.points.length < MIN_TRACE_POINTS) {
    throw new EngineError('too_few_points', `A trace needs at least ${MIN_TRACE_POINTS} points; it has ${input.points.length}`, {
      count: input.points.length,
      minimum: MIN_TRACE_POINTS,
    });
  }
  // Scans are nearly always recorded in delay order: check in one pass before paying for a sort.
  let inOrder = true;
  for (let i = 1; i < input.points.length && inOrder; i += 1) inOrder = input.points[i - 1]![0] <= input.points[i]![0];
  const sorted = inOrder ? input.points : [...input.points].sort((a, b) => a[0] - b[0]);
  const delays = sorted.map((p) => p[0]);
  const count = sorted.length;
  const wing = Math.max(1, Math.floor(count * WING_FRACTION));
  const leftWing = sorted.slice(0, wing).map((p) => p[1]);
  const rightWing = sorted.slice(count - wing).map((p) => p[1]);
  // The lower wing is the baseline: on a scan cut short, the other wing still sits on the pulse.
  const leftMedian = median(leftWing);
  const rightMedian = median(rightWing);
  const baselineWing = leftMedian <= rightMedian ? leftWing : rightWing;
  const baseline = Math.min(leftMedian, rightMedian);
  const values = sorted.map((p) => p[1] - baseline);
  const noise = 1.4826 * median(baselineWing.map((v) => Math.abs(v - baseline)));

  let peakIndex = 0;
  for (let i = 1; i < count; i += 1) if (values[i] > values[peakIndex]) peakIndex = i;
  const peak = peakHeight(delays, values, peakIndex);
  // A loop, not Math.max(...array): spreading 10⁵ arguments overflows the call stack.
  let scale = Number.MIN_VALUE;
  for (const p of sorted) scale = Math.max(scale, Math.abs(p[1]));
  if (!(peak > PEAK_NOISE_SIGMAS * noise) || peak <= 1e-12 * scale) {
    throw new EngineError('no_peak', 'The trace has no peak above its baseline noise', { baseline, noise, peak });
  }
  const half = peak / 2;
  let left: number | null = null;
  for (let i = peakIndex; i > 0; i -= 1) {
    if (values[i - 1] < half && values[i] >= half) {
      left = crossing(delays, values, i - 1, half);
      break;
    }
  }
  let right: number | null = null;
  for (let i = peakIndex; i < count - 1; i += 1) {
    if (values[i] >= half && values[i + 1] < half) {
      right = crossing(delays, values, i, half);
      break;
    }
  }
  if (left === null || right === null || !(right > left)) {
    throw new EngineError('peak_at_edge', 'The trace does not fall below half maximum on both sides of the peak; widen the delay scan', {
      peakDelayFs: delays[peakIndex],
      crossedLeft: left !== null,
      crossedRight: right !== null,
    });
  }
  const autocorrelationFwhmFs = right - left;
  const deconvolutionFactor = autocorrelationFactors[input.shape];
  return {
    shape: input.shape,
    baseline,
    peakSignal: peak,
    peakDelayFs: delays[peakIndex],
    autocorrelationFwhmFs,
    pulseFwhmFs: autocorrelationFwhmFs / deconvolutionFactor,
    deconvolutionFactor,
    pointCount: count,
  };
}
