import type { ReportQuery } from '../../../lib/query-keys';
import { fieldsToInstant, instantToFields } from '../../../lib/wall-time';

/** The report filters as the page holds them: dates are facility-zone calendar days, `to` inclusive. */
export interface ReportFilters {
  fromDate: string;
  toDate: string;
  groupBy: 'week' | 'month';
  instrumentId: string;
}

const DAY_MS = 86_400_000;

function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  const next = new Date(Date.UTC(y!, m! - 1, d! + days));
  return next.toISOString().slice(0, 10);
}

/** The last 8 weeks up to and including today in the facility zone, by week, all instruments. */
export function defaultReportFilters(timeZone: string, now: Date = new Date()): ReportFilters {
  const today = instantToFields(now, timeZone).date;
  return { fromDate: addDays(today, -55), toDate: today, groupBy: 'week', instrumentId: '' };
}

/** The API query: from the first day's midnight to the midnight after the last day, in the facility zone. */
export function reportQuery(filters: ReportFilters, timeZone: string): ReportQuery | null {
  const from = fieldsToInstant({ date: filters.fromDate, time: '00:00' }, timeZone);
  const to = /^\d{4}-\d{2}-\d{2}$/.test(filters.toDate) ? fieldsToInstant({ date: addDays(filters.toDate, 1), time: '00:00' }, timeZone) : null;
  if (!from || !to || to.instant.getTime() <= from.instant.getTime()) return null;
  if (to.instant.getTime() - from.instant.getTime() > 400 * DAY_MS) return null;
  return {
    from: from.instant.toISOString(),
    to: to.instant.toISOString(),
    groupBy: filters.groupBy,
    ...(filters.instrumentId ? { instrumentId: filters.instrumentId } : {}),
  };
}

export function queryString(query: Partial<ReportQuery>): string {
  const params = new URLSearchParams();
  for (const key of ['from', 'to', 'groupBy', 'instrumentId'] as const) {
    const value = query[key];
    if (value) params.set(key, value);
  }
  return params.toString();
}

export const utilisationCsvHref = (query: ReportQuery) => `/api/reports/utilisation.csv?${queryString(query)}`;
export const tuningCoverageCsvHref = (query: ReportQuery) => {
  const { groupBy: _unused, ...rest } = query;
  return `/api/reports/tuning-coverage.csv?${queryString(rest)}`;
};
export const pulseTrendCsvHref = (query: ReportQuery) => tuningCoverageCsvHref(query).replace('/tuning-coverage.csv?', '/pulse-trend.csv?');
