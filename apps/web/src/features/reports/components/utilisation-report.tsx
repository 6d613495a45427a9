import type { UtilisationRowDto } from '@femtoslot/shared';
import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { utilisationByInstrument } from '../lib/chart-data';
import { ReportPanel, axisTick, hours, periodLabel, tableClass, td, th, tooltipStyle } from './report-panel';

const series = [
  { key: 'loggedHours', name: 'Logged', fill: 'var(--color-accent)' },
  { key: 'bookedNotLoggedHours', name: 'Booked, not logged', fill: 'color-mix(in srgb, var(--color-accent) 35%, var(--color-panel))' },
  { key: 'maintenanceHours', name: 'Maintenance', fill: 'url(#fs-maintenance-hatch)' },
  { key: 'changeoverHours', name: 'Changeover', fill: 'var(--color-caution-line)' },
] as const;

function HatchPattern() {
  return (
    <defs>
      <pattern id="fs-maintenance-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill="var(--color-sunk)" />
        <line x1="0" y1="0" x2="0" y2="6" stroke="var(--color-ink-muted)" strokeWidth="2.2" />
      </pattern>
    </defs>
  );
}

export function UtilisationReport({ rows, groupBy, csvHref }: { rows: UtilisationRowDto[]; groupBy: 'week' | 'month'; csvHref: string }) {
  const groups = utilisationByInstrument(rows);
  const chart = (
    <div className="grid gap-4 lg:grid-cols-2">
      {groups.map((group) => (
        <figure key={group.instrumentId} className="min-w-0">
          <figcaption className="mb-1 text-sm font-semibold">{group.instrumentName}</figcaption>
          <BarChart responsive data={group.bars} margin={{ top: 8, right: 8, bottom: 4, left: 0 }} style={{ width: '100%', height: 240 }}>
            <HatchPattern />
            <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" vertical={false} />
            <XAxis dataKey="period" tickFormatter={(p: string) => periodLabel(p, groupBy)} tick={axisTick} />
            <YAxis width={44} tick={axisTick} label={{ value: 'hours', angle: -90, position: 'insideLeft', fill: 'var(--color-ink-muted)', fontSize: 11 }} />
            <Tooltip
              contentStyle={tooltipStyle}
              labelFormatter={(p) => `${groupBy === 'month' ? 'Month of' : 'Week of'} ${periodLabel(String(p), groupBy)}`}
              formatter={(value, name) => [`${hours.format(Number(value))} h`, name]}
            />
            <Legend wrapperStyle={{ fontSize: 12 }} itemSorter={null} formatter={(value) => <span style={{ color: 'var(--color-ink)' }}>{value}</span>} />
            {series.map((s) => (
              <Bar key={s.key} dataKey={s.key} name={s.name} stackId="hours" fill={s.fill} stroke={s.key === 'maintenanceHours' ? 'var(--color-ink-muted)' : undefined} isAnimationActive={false} />
            ))}
          </BarChart>
        </figure>
      ))}
    </div>
  );
  const table = (
    <table data-testid="utilisation-table" className={tableClass}>
      <caption className="sr-only">Hours per {groupBy} and instrument: booked, logged, maintenance and changeover</caption>
      <thead>
        <tr>
          <th scope="col" className={th}>{groupBy === 'month' ? 'Month' : 'Week of'}</th>
          <th scope="col" className={th}>Instrument</th>
          <th scope="col" className={th}>Booked (h)</th>
          <th scope="col" className={th}>Logged (h)</th>
          <th scope="col" className={th}>Maintenance (h)</th>
          <th scope="col" className={th}>Changeover (h)</th>
        </tr>
      </thead>
      <tbody>
        {groups.flatMap((g) =>
          g.bars.map((b) => (
            <tr key={`${g.instrumentId}-${b.period}`}>
              <td className={td}>{periodLabel(b.period, groupBy)} <span className="sr-only">({b.period})</span></td>
              <td className={td}>{g.instrumentName}</td>
              <td className={td}>{hours.format(b.bookedHours)}</td>
              <td className={td}>{hours.format(b.loggedHours)}</td>
              <td className={td}>{hours.format(b.maintenanceHours)}</td>
              <td className={td}>{hours.format(b.changeoverHours)}</td>
            </tr>
          )),
        )}
      </tbody>
    </table>
  );
  return (
    <ReportPanel
      title="Utilisation"
      description="Hours per period on each instrument. Logged hours are stacked under the booked hours that were not logged, so each bar is the time taken: beam time, maintenance (hatched) and changeover."
      chart={chart}
      chartTestId="utilisation-chart"
      table={table}
      csvHref={csvHref}
      empty={rows.length === 0}
      emptyText="No bookings, maintenance or changeover in this range."
    />
  );
}
