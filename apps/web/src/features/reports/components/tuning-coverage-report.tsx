import type { TuningCoverageDto } from '@femtoslot/shared';
import { CartesianGrid, ErrorBar, Legend, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZAxis } from 'recharts';
import { formatInstant } from '../../../lib/wall-time';
import { type CoveragePoint, coverageSeries, logWavelengthAxis, wavelengthTick } from '../lib/chart-data';
import { ReportPanel, axisTick, tableClass, td, th, tooltipStyle } from './report-panel';

export interface TimeAxis {
  fromMs: number;
  toMs: number;
  timeZone: string;
}

export const dayTick = (timeZone: string) => (ms: number) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone }).format(new Date(ms));

const nm = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

export interface TuningCoverageReportProps {
  segments: TuningCoverageDto['segments'];
  axis: TimeAxis;
  colourFor: (configurationKey: string) => string;
  legendFor: (configurationKey: string) => string | undefined;
  csvHref: string;
}

/** Each logged segment's tuning range as a vertical bar at its start, on a logarithmic wavelength axis. */
export function TuningCoverageReport({ segments, axis, colourFor, legendFor, csvHref }: TuningCoverageReportProps) {
  const series = coverageSeries(segments);
  const wavelengths = segments.flatMap((s) => [s.minNm, s.maxNm]);
  const yAxis = logWavelengthAxis(Math.min(...wavelengths, 1e9), Math.max(...wavelengths, 0));
  const chart = (
    <ScatterChart responsive margin={{ top: 8, right: 16, bottom: 8, left: 8 }} style={{ width: '100%', height: 320 }}>
      <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" />
      <XAxis type="number" dataKey="t" domain={[axis.fromMs, axis.toMs]} scale="time" tickFormatter={dayTick(axis.timeZone)} tick={axisTick} name="Start" />
      <YAxis
        type="number"
        dataKey="centreNm"
        scale="log"
        domain={yAxis.domain}
        ticks={yAxis.ticks}
        allowDataOverflow
        tickFormatter={wavelengthTick}
        tick={axisTick}
        width={64}
        name="Wavelength"
      />
      <Tooltip
        contentStyle={tooltipStyle}
        content={({ payload }) => {
          const point = payload?.[0]?.payload as CoveragePoint | undefined;
          if (!point) return null;
          return (
            <div style={tooltipStyle} className="rounded border px-2 py-1">
              {formatInstant(point.startsAt, axis.timeZone)}: {nm.format(point.minNm)}–{nm.format(point.maxNm)} nm
            </div>
          );
        }}
      />
      <ZAxis range={[18, 18]} />
      <Legend wrapperStyle={{ fontSize: 12 }} formatter={(value) => <span style={{ color: 'var(--color-ink)' }}>{value}</span>} />
      {series.map((s) => (
        <Scatter key={s.key} name={legendFor(s.key) ?? s.name} data={s.points} fill={colourFor(s.key)} shape="circle" isAnimationActive={false}>
          <ErrorBar dataKey="spanNm" direction="y" width={8} strokeWidth={4} stroke={colourFor(s.key)} />
        </Scatter>
      ))}
    </ScatterChart>
  );
  const rows = [...segments].sort((a, b) => a.startsAt.localeCompare(b.startsAt));
  const table = (
    <table data-testid="tuning-table" className={tableClass}>
      <caption className="sr-only">Tuning range covered by each logged segment</caption>
      <thead>
        <tr>
          <th scope="col" className={th}>Segment start</th>
          <th scope="col" className={th}>Configuration</th>
          <th scope="col" className={th}>From (nm)</th>
          <th scope="col" className={th}>To (nm)</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((s, i) => (
          <tr key={`${s.startsAt}-${s.configurationKey}-${i}`}>
            <td className={td}>{formatInstant(s.startsAt, axis.timeZone)}</td>
            <td className={td}>{s.configurationName}</td>
            <td className={td}>{nm.format(s.minNm)}</td>
            <td className={td}>{nm.format(s.maxNm)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
  return (
    <ReportPanel
      title="Tuning coverage"
      description="Wavelengths used per configuration over time, on a logarithmic axis from the visible to the mid-infrared. Each bar is one segment's tuning range; infrared colours are a key, not a hue."
      chart={chart}
      chartTestId="tuning-chart"
      table={table}
      csvHref={csvHref}
      empty={segments.length === 0}
      emptyText="No segments logged in this range."
    />
  );
}
