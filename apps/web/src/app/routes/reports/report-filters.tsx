import type { ReactNode } from 'react';
import type { ReportFilters } from '../../../features/reports/lib/report-query';

const control = 'rounded-lg border border-line bg-panel px-3 py-2 text-sm';

export interface ReportFiltersBarProps {
  filters: ReportFilters;
  onChange: (next: ReportFilters) => void;
  instruments: { id: string; name: string }[];
  timeZone: string;
  invalid: boolean;
  children?: ReactNode;
}

/** Date range (facility-zone days, both ends included), grouping and instrument for every report on the page. */
export function ReportFiltersBar({ filters, onChange, instruments, timeZone, invalid, children }: ReportFiltersBarProps) {
  const set = <K extends keyof ReportFilters>(key: K, value: ReportFilters[K]) => onChange({ ...filters, [key]: value });
  return (
    <div className="space-y-1.5">
      <form className="flex flex-wrap items-end gap-3" aria-label="Report filters" onSubmit={(e) => e.preventDefault()}>
        <label className="text-sm">
          <span className="mb-1 block font-semibold">From</span>
          <input type="date" name="from" data-testid="report-from" value={filters.fromDate} onChange={(e) => set('fromDate', e.target.value)} className={control} />
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-semibold">To (included)</span>
          <input type="date" name="to" data-testid="report-to" value={filters.toDate} onChange={(e) => set('toDate', e.target.value)} className={control} />
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-semibold">Group by</span>
          <select name="groupBy" data-testid="report-group-by" value={filters.groupBy} onChange={(e) => set('groupBy', e.target.value as ReportFilters['groupBy'])} className={control}>
            <option value="week">Week</option>
            <option value="month">Month</option>
          </select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-semibold">Instrument</span>
          <select name="instrumentId" data-testid="report-instrument" value={filters.instrumentId} onChange={(e) => set('instrumentId', e.target.value)} className={control}>
            <option value="">All instruments</option>
            {instruments.map((i) => (
              <option key={i.id} value={i.id}>
                {i.name}
              </option>
            ))}
          </select>
        </label>
        {children}
      </form>
      <p className={invalid ? 'text-sm font-semibold text-danger' : 'text-xs text-ink-muted'}>
        {invalid ? 'Choose a range that ends after it starts and spans at most 400 days.' : `Days in ${timeZone} (facility time).`}
      </p>
    </div>
  );
}
