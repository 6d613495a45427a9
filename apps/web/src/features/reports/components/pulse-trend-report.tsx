import type { TuningCoverageDto } from '@femtoslot/shared';
import { CartesianGrid, Legend, ReferenceLine, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import { formatInstant } from '../../../lib/wall-time';
import { pulseDomain, pulseSeries, pulseShapeName } from '../lib/chart-data';
import { ReportPanel, axisTick, tableClass, td, th, tooltipStyle } from './report-panel';
import { type TimeAxis, dayTick } from './tuning-coverage-report';

const fs = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

export interface PulseTrendReportProps {
  trend: TuningCoverageDto['pulseTrend'];
  specFs: number | null;
  axis: TimeAxis;
  colourFor: (configurationKey: string) => string;
  nameFor: (configurationKey: string) => string;
  csvHref: string;
}

// One marker and line style per assumed shape, so the series stay apart without relying on colour.
const shapeStyle = { gaussian: { marker: 'circle', dash: undefined }, sech2: { marker: 'diamond', dash: '5 3' }, unstated: { marker: 'cross', dash: '1 3' } } as const;

/** Measured pump pulse duration over time against the facility's specification, one series per assumed pulse shape. */
export function PulseTrendReport({ trend, specFs, axis, colourFor, nameFor, csvHref }: PulseTrendReportProps) {
  const points = [...trend].sort((a, b) => a.startsAt.localeCompare(b.startsAt)).map((p) => ({ ...p, t: Date.parse(p.startsAt) }));
  const series = pulseSeries(points);
  const chart = (
    <ScatterChart responsive margin={{ top: 16, right: 16, bottom: 8, left: 8 }} style={{ width: '100%', height: 260 }}>
      <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" />
      <XAxis type="number" dataKey="t" domain={[axis.fromMs, axis.toMs]} scale="time" tickFormatter={dayTick(axis.timeZone)} tick={axisTick} name="Measured" />
      <YAxis type="number" dataKey="pulseFwhmFs" domain={pulseDomain(points.map((p) => p.pulseFwhmFs), specFs)} tick={axisTick} width={56} tickFormatter={(v: number) => `${v} fs`} name="Pulse FWHM" />
      <Tooltip
        contentStyle={tooltipStyle}
        formatter={(value, name) => (name === 'Measured' ? [formatInstant(new Date(Number(value)), axis.timeZone), name] : [`${fs.format(Number(value))} fs`, name])}
      />
      <Legend wrapperStyle={{ fontSize: 12 }} formatter={(value) => <span style={{ color: 'var(--color-ink)' }}>{value}</span>} />
      {specFs !== null && (
        <ReferenceLine
          y={specFs}
          stroke="var(--color-danger)"
          strokeDasharray="6 4"
          label={{ value: `Specification ${fs.format(specFs)} fs`, position: 'insideTopRight', fill: 'var(--color-danger)', fontSize: 11 }}
        />
      )}
      {series.map((s) => {
        const colour = colourFor(s.points[0]!.configurationKey);
        return (
          <Scatter key={s.key} name={s.label} data={s.points} fill={colour} shape={shapeStyle[s.key].marker} line={{ stroke: colour, strokeWidth: 1.5, strokeDasharray: shapeStyle[s.key].dash }} isAnimationActive={false} />
        );
      })}
    </ScatterChart>
  );
  const table = (
    <table data-testid="pulse-table" className={tableClass}>
      <caption className="sr-only">
        Measured pulse duration (FWHM) over time{specFs !== null ? `; specification ${fs.format(specFs)} fs` : ''}
      </caption>
      <thead>
        <tr>
          <th scope="col" className={th}>Measured</th>
          <th scope="col" className={th}>Configuration</th>
          <th scope="col" className={th}>Assumed shape</th>
          <th scope="col" className={th}>Pulse FWHM (fs)</th>
          <th scope="col" className={th}>Autocorrelation FWHM (fs)</th>
          {specFs !== null && <th scope="col" className={th}>Against the specification</th>}
        </tr>
      </thead>
      <tbody>
        {points.map((p, i) => (
          <tr key={`${p.startsAt}-${i}`}>
            <td className={td}>{formatInstant(p.startsAt, axis.timeZone)}</td>
            <td className={td}>{nameFor(p.configurationKey)}</td>
            <td className={td}>{pulseShapeName(p.pulseShape)}</td>
            <td className={td}>{fs.format(p.pulseFwhmFs)}</td>
            <td className={td}>{p.autocorrelationFwhmFs === null ? '—' : fs.format(p.autocorrelationFwhmFs)}</td>
            {specFs !== null && <td className={td}>{p.pulseFwhmFs <= specFs ? 'within' : `${fs.format(p.pulseFwhmFs - specFs)} fs over`}</td>}
          </tr>
        ))}
      </tbody>
    </table>
  );
  return (
    <ReportPanel
      title="Pump pulse duration"
      description={`Pulse FWHM measured in logged sessions, one series per assumed pulse shape (a sech² reading of the same autocorrelation is 8 % shorter than a Gaussian one; compare within a series, or by autocorrelation FWHM in the table)${specFs !== null ? `, with the facility's specification of ${fs.format(specFs)} fs as a dashed line` : ''}.`}
      chart={chart}
      chartTestId="pulse-chart"
      table={table}
      tableShown
      csvHref={csvHref}
      empty={points.length === 0}
      emptyText="No pulse durations logged in this range."
    />
  );
}
