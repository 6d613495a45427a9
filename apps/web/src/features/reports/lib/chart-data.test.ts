import { describe, expect, it } from 'vitest';
import { coverageSeries, logWavelengthAxis, pulseDomain, pulseSeries, utilisationByInstrument, wavelengthTick } from './chart-data';
import { defaultReportFilters, reportQuery, tuningCoverageCsvHref, utilisationCsvHref } from './report-query';

const row = (period: string, instrumentId: string, booked: number, logged: number) => ({
  period, instrumentId, instrumentName: instrumentId === 'a' ? 'Aurora line' : 'Pump-probe station', bookedHours: booked, loggedHours: logged, maintenanceHours: 2, changeoverHours: 0.5,
});

describe('report chart data', () => {
  it('when rows for two instruments arrive, then each gets its own chart and the stack does not count logged hours twice', () => {
    const groups = utilisationByInstrument([row('2026-03-09', 'a', 20, 18), row('2026-03-02', 'a', 10, 12), row('2026-03-02', 'b', 5, 5)]);
    expect(groups.map((g) => g.instrumentName)).toEqual(['Aurora line', 'Pump-probe station']);
    expect(groups[0]!.bars.map((b) => b.period)).toEqual(['2026-03-02', '2026-03-09']);
    const [overrun, normal] = groups[0]!.bars;
    expect(normal!.loggedHours + normal!.bookedNotLoggedHours).toBe(20);
    expect(overrun!.bookedNotLoggedHours).toBe(0);
  });

  it('when a segment covers 1200–1500 nm, then its bar is centred geometrically and spans exactly the range', () => {
    const [series] = coverageSeries([{ configurationKey: 'opa_signal', configurationName: 'OPA signal', startsAt: '2026-03-03T14:00:00Z', minNm: 1200, maxNm: 1500 }]);
    const point = series!.points[0]!;
    expect(point.centreNm).toBeCloseTo(Math.sqrt(1200 * 1500), 9);
    expect(point.centreNm - point.spanNm[0]).toBeCloseTo(1200, 9);
    expect(point.centreNm + point.spanNm[1]).toBeCloseTo(1500, 9);
  });

  it('when the data run from 400 nm to 11 µm, then the log axis covers them with round ticks including the decades', () => {
    const axis = logWavelengthAxis(400, 11000);
    expect(axis.domain[0]).toBeLessThanOrEqual(400);
    expect(axis.domain[1]).toBeGreaterThanOrEqual(11000);
    expect(axis.ticks).toContain(1000);
    expect(axis.ticks).toContain(10000);
    expect(axis.ticks.length).toBeLessThanOrEqual(10);
    expect(wavelengthTick(800)).toBe('800 nm');
    expect(wavelengthTick(1500)).toBe('1.5 µm');
  });

  it('when the specification is above every measured pulse, then the y domain still shows it', () => {
    expect(pulseDomain([90, 110], 150)[1]).toBeGreaterThan(150);
    expect(pulseDomain([90, 110], null)[1]).toBeGreaterThan(110);
  });
});

describe('report query', () => {
  it('when no range is chosen, then it is the last 8 weeks ending today in the facility zone, by week', () => {
    const filters = defaultReportFilters('America/New_York', new Date('2026-03-20T02:00:00Z'));
    // Source: IANA tz database — 02:00 UTC on 20 Mar 2026 is 22:00 on 19 Mar in New York (UTC−4)
    expect(filters).toEqual({ fromDate: '2026-01-23', toDate: '2026-03-19', groupBy: 'week', instrumentId: '' });
  });

  it('when the dates are read, then the query runs midnight to the midnight after the last day and the CSV links repeat it', () => {
    const query = reportQuery({ fromDate: '2026-03-02', toDate: '2026-03-08', groupBy: 'month', instrumentId: 'abc' }, 'America/New_York')!;
    // Source: IANA tz database — New York is UTC−5 until 8 Mar 2026 02:00, UTC−4 after
    expect(query).toEqual({ from: '2026-03-02T05:00:00.000Z', to: '2026-03-09T04:00:00.000Z', groupBy: 'month', instrumentId: 'abc' });
    expect(utilisationCsvHref(query)).toBe('/api/reports/utilisation.csv?from=2026-03-02T05%3A00%3A00.000Z&to=2026-03-09T04%3A00%3A00.000Z&groupBy=month&instrumentId=abc');
    expect(tuningCoverageCsvHref(query)).toBe('/api/reports/tuning-coverage.csv?from=2026-03-02T05%3A00%3A00.000Z&to=2026-03-09T04%3A00%3A00.000Z&instrumentId=abc');
  });

  it('when the range is back to front, then there is no query', () => {
    expect(reportQuery({ fromDate: '2026-03-08', toDate: '2026-03-01', groupBy: 'week', instrumentId: '' }, 'UTC')).toBeNull();
  });
});

describe('pulse trend series', () => {
  const point = (startsAt: string, pulseFwhmFs: number, pulseShape: 'gaussian' | 'sech2' | null) => ({
    startsAt, pulseFwhmFs, configurationKey: 'fundamental', pulseShape,
    // Diels & Rudolph: AC FWHM = pulse × 1.414 (Gaussian), × 1.543 (sech²)
    autocorrelationFwhmFs: pulseShape === 'gaussian' ? pulseFwhmFs * 1.41421 : pulseShape === 'sech2' ? pulseFwhmFs * 1.5427 : null,
  });

  it('when Gaussian, sech² and unstated readings are mixed, then each shape is a series of its own, labelled with its factor', () => {
    const series = pulseSeries([point('2026-03-02', 50, 'gaussian'), point('2026-03-03', 46, 'sech2'), point('2026-03-04', 52, 'gaussian'), point('2026-03-05', 60, null)]);
    expect(series.map((s) => [s.key, s.points.length])).toEqual([['gaussian', 2], ['sech2', 1], ['unstated', 1]]);
    expect(series.map((s) => s.label)).toEqual(['Gaussian (AC ÷ 1.414)', 'sech² (AC ÷ 1.543)', 'Shape not stated']);
    expect(pulseSeries([point('2026-03-02', 50, 'sech2')]).map((s) => s.key)).toEqual(['sech2']);
  });
});
