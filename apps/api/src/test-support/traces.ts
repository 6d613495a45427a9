/**
 * A Gaussian intensity autocorrelation for a pulse of FWHM τ: itself Gaussian with FWHM √2·τ
 * (Diels & Rudolph, Ultrashort Laser Pulse Phenomena), sampled over ±4 AC widths, on a constant baseline.
 */
export function gaussianTrace(pulseFwhmFs: number, { baseline = 0.05, samplesPerFwhm = 40 } = {}): Array<[number, number]> {
  const ac = Math.SQRT2 * pulseFwhmFs;
  const points: Array<[number, number]> = [];
  for (let d = -4 * ac; d <= 4 * ac; d += ac / samplesPerFwhm) points.push([d, baseline + Math.exp((-4 * Math.LN2 * d * d) / (ac * ac))]);
  return points;
}

/** The trace as the CSV a lab instrument would write: a header line, then delay and signal per line. */
export function traceCsv(points: Array<[number, number]>, { delimiter = ',', lineEnd = '\n', delayDigits = 2 } = {}): string {
  return [`delay_fs${delimiter}signal`, ...points.map(([d, s]) => `${d.toFixed(delayDigits)}${delimiter}${s.toFixed(6)}`)].join(lineEnd);
}

export { interferometricTrace } from '@femtoslot/shared/metrology/test-traces';
