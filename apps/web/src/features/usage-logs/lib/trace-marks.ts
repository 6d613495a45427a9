import type { AutocorrelationResult } from '@femtoslot/shared';

export interface HalfMaximumMarks {
  /** the half-maximum level in the trace's own signal units (baseline included) */
  level: number;
  baseline: number;
  peakLevel: number;
  leftDelayFs: number;
  rightDelayFs: number;
}

export interface TracePoint {
  delayFs: number;
  signal: number;
}

const sortByDelay = (points: Array<[number, number]>) => [...points].sort((a, b) => a[0] - b[0]);

/**
 * Where the trace crosses half maximum on each side of its peak, found the way the engine finds its FWHM
 * (baseline-corrected, linear interpolation between samples), so the plotted marks are the measured width.
 */
export function halfMaximumMarks(points: Array<[number, number]>, result: Pick<AutocorrelationResult, 'baseline' | 'peakSignal'>): HalfMaximumMarks | null {
  const sorted = sortByDelay(points);
  const delays = sorted.map((p) => p[0]);
  const values = sorted.map((p) => p[1] - result.baseline);
  if (values.length < 2) return null;
  let peakIndex = 0;
  for (let i = 1; i < values.length; i += 1) if (values[i]! > values[peakIndex]!) peakIndex = i;
  const half = result.peakSignal / 2;
  const at = (i: number) => {
    const t = (half - values[i]!) / (values[i + 1]! - values[i]!);
    return delays[i]! + t * (delays[i + 1]! - delays[i]!);
  };
  let left: number | null = null;
  for (let i = peakIndex; i > 0; i -= 1) {
    if (values[i - 1]! < half && values[i]! >= half) {
      left = at(i - 1);
      break;
    }
  }
  let right: number | null = null;
  for (let i = peakIndex; i < values.length - 1; i += 1) {
    if (values[i]! >= half && values[i + 1]! < half) {
      right = at(i);
      break;
    }
  }
  if (left === null || right === null) return null;
  return {
    level: result.baseline + half,
    baseline: result.baseline,
    peakLevel: result.baseline + result.peakSignal,
    leftDelayFs: left,
    rightDelayFs: right,
  };
}

/** Points for the chart, in delay order; long scans are thinned to about `limit` points for drawing only. */
export function traceChartPoints(points: Array<[number, number]>, limit = 1500): TracePoint[] {
  const sorted = sortByDelay(points);
  const stride = Math.max(1, Math.ceil(sorted.length / limit));
  return sorted.filter((_, i) => i % stride === 0 || i === sorted.length - 1).map(([delayFs, signal]) => ({ delayFs, signal }));
}
