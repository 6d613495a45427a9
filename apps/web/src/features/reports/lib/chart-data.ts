import type { TuningCoverageDto, UtilisationRowDto } from '@femtoslot/shared';

export interface UtilisationBar {
  period: string;
  bookedHours: number;
  loggedHours: number;
  /** booked hours with no logged use; stacked on the logged hours so the bar is not counted twice */
  bookedNotLoggedHours: number;
  maintenanceHours: number;
  changeoverHours: number;
}

export interface InstrumentUtilisation {
  instrumentId: string;
  instrumentName: string;
  bars: UtilisationBar[];
}

const round2 = (n: number) => Math.round(n * 100) / 100;

/** One small chart per instrument, periods in order. */
export function utilisationByInstrument(rows: readonly UtilisationRowDto[]): InstrumentUtilisation[] {
  const groups = new Map<string, InstrumentUtilisation>();
  for (const row of rows) {
    const group = groups.get(row.instrumentId) ?? { instrumentId: row.instrumentId, instrumentName: row.instrumentName, bars: [] };
    group.bars.push({
      period: row.period,
      bookedHours: row.bookedHours,
      loggedHours: row.loggedHours,
      bookedNotLoggedHours: round2(Math.max(0, row.bookedHours - row.loggedHours)),
      maintenanceHours: row.maintenanceHours,
      changeoverHours: row.changeoverHours,
    });
    groups.set(row.instrumentId, group);
  }
  for (const group of groups.values()) group.bars.sort((a, b) => a.period.localeCompare(b.period));
  return [...groups.values()].sort((a, b) => a.instrumentName.localeCompare(b.instrumentName));
}

export interface CoveragePoint {
  t: number;
  /** geometric centre of the range: the middle of the bar on a logarithmic axis */
  centreNm: number;
  /** [below, above] the centre, for the error bar that draws the range */
  spanNm: [number, number];
  minNm: number;
  maxNm: number;
  startsAt: string;
}

export interface CoverageSeries {
  key: string;
  name: string;
  points: CoveragePoint[];
}

/** Logged segments grouped by configuration, each range drawn as a vertical bar at its start time. */
export function coverageSeries(segments: TuningCoverageDto['segments']): CoverageSeries[] {
  const series = new Map<string, CoverageSeries>();
  for (const s of segments) {
    const entry = series.get(s.configurationKey) ?? { key: s.configurationKey, name: s.configurationName, points: [] };
    const centreNm = Math.sqrt(s.minNm * s.maxNm);
    entry.points.push({ t: Date.parse(s.startsAt), centreNm, spanNm: [centreNm - s.minNm, s.maxNm - centreNm], minNm: s.minNm, maxNm: s.maxNm, startsAt: s.startsAt });
    series.set(s.configurationKey, entry);
  }
  for (const entry of series.values()) entry.points.sort((a, b) => a.t - b.t);
  return [...series.values()];
}

const mantissas = [1, 1.5, 2, 3, 4, 5, 6, 8];

/** A logarithmic wavelength domain padded a little beyond the data, with round-number ticks inside it. */
export function logWavelengthAxis(minNm: number, maxNm: number): { domain: [number, number]; ticks: number[] } {
  const lo = minNm / 1.2;
  const hi = maxNm * 1.2;
  const ticks: number[] = [];
  for (let decade = 10 ** Math.floor(Math.log10(lo)); decade <= hi; decade *= 10) {
    for (const m of mantissas) {
      const tick = Math.round(m * decade);
      if (tick >= lo && tick <= hi) ticks.push(tick);
    }
  }
  // keep the axis legible: thin to about eight ticks, keeping the decades
  const stride = Math.ceil(ticks.length / 8);
  const thinned = ticks.filter((t, i) => i % stride === 0 || Number.isInteger(Math.log10(t)));
  return { domain: [Math.floor(lo), Math.ceil(hi)], ticks: thinned };
}

/** "800 nm", "1.5 µm", "10 µm" — nm below a micron, µm above. */
export function wavelengthTick(nm: number): string {
  return nm < 1000 ? `${nm} nm` : `${new Intl.NumberFormat('en', { maximumFractionDigits: 2 }).format(nm / 1000)} µm`;
}

/** A pulse-trend y domain from zero that keeps the specification line in view. */
export function pulseDomain(values: readonly number[], specFs: number | null): [number, number] {
  const top = Math.max(...values, specFs ?? 0, 1);
  return [0, Math.ceil((top * 1.15) / 10) * 10];
}

type PulsePoint = TuningCoverageDto['pulseTrend'][number];
export type PulseSeriesKey = 'gaussian' | 'sech2' | 'unstated';

/**
 * The pulse trend split by assumed shape: a Gaussian and a sech² reading of the same autocorrelation differ by
 * 1.543 / 1.414 (Diels & Rudolph), so each shape is its own series and points of different shapes are never joined.
 */
export function pulseSeries<P extends PulsePoint>(points: readonly P[]): { key: PulseSeriesKey; label: string; points: P[] }[] {
  const labels: Record<PulseSeriesKey, string> = { gaussian: 'Gaussian (AC ÷ 1.414)', sech2: 'sech² (AC ÷ 1.543)', unstated: 'Shape not stated' };
  return (['gaussian', 'sech2', 'unstated'] as const)
    .map((key) => ({ key, label: labels[key], points: points.filter((p) => (p.pulseShape ?? 'unstated') === key) }))
    .filter((s) => s.points.length > 0);
}

export const pulseShapeName = (shape: PulsePoint['pulseShape']) => (shape === 'sech2' ? 'sech²' : shape === 'gaussian' ? 'Gaussian' : 'not stated');
