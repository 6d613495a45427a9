import type { HoursByDto } from '@femtoslot/shared';
import { Bar, BarChart, CartesianGrid, Cell, Tooltip, XAxis, YAxis } from 'recharts';
import { ReportPanel, axisTick, hours, tableClass, td, th, tooltipStyle } from './report-panel';

export interface HoursByReportProps {
  title: string;
  description: string;
  what: string;
  rows: HoursByDto[];
  /** bar colour per row key; configurations use their spectral or false colour */
  colourFor: (key: string) => string;
  chartTestId: string;
  tableTestId: string;
  csvHref: string;
}

/** Logged hours by one dimension as horizontal bars, largest first. */
export function HoursByReport({ title, description, what, rows, colourFor, chartTestId, tableTestId, csvHref }: HoursByReportProps) {
  const sorted = [...rows].sort((a, b) => b.loggedHours - a.loggedHours);
  const chart = (
    <BarChart responsive layout="vertical" data={sorted} margin={{ top: 4, right: 16, bottom: 4, left: 4 }} style={{ width: '100%', height: Math.max(120, 36 * sorted.length + 40) }}>
      <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" horizontal={false} />
      <XAxis type="number" tick={axisTick} tickFormatter={(v: number) => `${v} h`} />
      <YAxis type="category" dataKey="label" width={130} tick={axisTick} />
      <Tooltip contentStyle={tooltipStyle} formatter={(value) => [`${hours.format(Number(value))} h`, 'Logged']} />
      <Bar dataKey="loggedHours" name="Logged hours" isAnimationActive={false} radius={[0, 3, 3, 0]}>
        {sorted.map((row) => (
          <Cell key={row.key} fill={colourFor(row.key)} />
        ))}
      </Bar>
    </BarChart>
  );
  const table = (
    <table data-testid={tableTestId} className={tableClass}>
      <caption className="sr-only">Logged hours by {what}</caption>
      <thead>
        <tr>
          <th scope="col" className={th}>{what[0]!.toUpperCase() + what.slice(1)}</th>
          <th scope="col" className={th}>Logged (h)</th>
        </tr>
      </thead>
      <tbody>
        {sorted.map((row) => (
          <tr key={row.key} data-key={row.key}>
            <td className={td}>{row.label}</td>
            <td className={td}>{hours.format(row.loggedHours)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
  return (
    <ReportPanel
      title={title}
      description={description}
      chart={chart}
      chartTestId={chartTestId}
      table={table}
      tableShown
      csvHref={csvHref}
      empty={rows.length === 0}
      emptyText="No logged hours in this range."
    />
  );
}
