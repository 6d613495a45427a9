import { type ReactNode, useId, useState } from 'react';
import { cx } from '../../../lib/cx';

export interface ReportPanelProps {
  title: string;
  description?: ReactNode;
  chart: ReactNode;
  chartTestId: string;
  /** the same numbers as the chart, as a real table */
  table: ReactNode;
  csvHref: string;
  /** long tables start folded away visually; they stay in the page for screen readers */
  tableShown?: boolean;
  empty?: boolean;
  emptyText?: string;
}

/** A chart with its numbers: the table is always in the DOM (folding only hides it visually) and exports as CSV. */
export function ReportPanel({ title, description, chart, chartTestId, table, csvHref, tableShown = false, empty = false, emptyText }: ReportPanelProps) {
  const [shown, setShown] = useState(tableShown);
  const tableId = useId();
  return (
    <section className="min-w-0 space-y-3 rounded-xl border border-line bg-panel px-4 py-4" aria-label={title}>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 className="text-base font-bold">{title}</h2>
          {description && <p className="mt-0.5 max-w-prose text-xs text-ink-muted">{description}</p>}
        </div>
        <div className="flex items-center gap-1.5 text-sm">
          <button
            type="button"
            aria-controls={tableId}
            aria-expanded={shown}
            onClick={() => setShown(!shown)}
            className="rounded-lg px-2.5 py-1 font-semibold text-ink-muted hover:bg-sunk hover:text-ink"
          >
            {shown ? 'Hide the table' : 'Show as a table'}
          </button>
          <a href={csvHref} download data-testid="export-csv" className="rounded-lg border border-line px-2.5 py-1 font-semibold text-accent hover:bg-sunk">
            Export CSV
          </a>
        </div>
      </header>
      <div data-testid={chartTestId} aria-hidden="true">
        {empty ? <p className="py-10 text-center text-sm text-ink-muted">{emptyText ?? 'Nothing logged in this range.'}</p> : chart}
      </div>
      <div id={tableId} className={cx(shown ? 'overflow-x-auto' : 'sr-only')}>
        {table}
      </div>
    </section>
  );
}

export const hours = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 2 });

export const th = 'px-3 py-2 text-left text-xs font-semibold tracking-wide text-ink-muted uppercase';
export const td = 'px-3 py-1.5 tabular-nums';
export const tableClass = 'w-full border-collapse text-sm [&_tbody_tr]:border-t [&_tbody_tr]:border-line';

/** "3 Mar" for a week, "Mar 2026" for a month; `period` is the first day as an ISO date. */
export function periodLabel(period: string, groupBy: 'week' | 'month'): string {
  const date = new Date(`${period.slice(0, 10)}T12:00:00Z`);
  if (Number.isNaN(date.getTime())) return period;
  return new Intl.DateTimeFormat('en-GB', groupBy === 'month' ? { month: 'short', year: 'numeric', timeZone: 'UTC' } : { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(date);
}

export const axisTick = { fill: 'var(--color-ink-muted)', fontSize: 11 };
export const tooltipStyle = { background: 'var(--color-panel)', borderColor: 'var(--color-line)', fontSize: 12, color: 'var(--color-ink)' };
