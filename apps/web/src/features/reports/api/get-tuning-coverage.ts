import type { TuningCoverageDto } from '@femtoslot/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { type ReportQuery, reportKeys } from '../../../lib/query-keys';
import { queryString } from '../lib/report-query';

type CoverageQuery = Omit<ReportQuery, 'groupBy'>;

/** Logged tuning ranges per configuration over time, and the pump's pulse-duration trend. */
export const getTuningCoverage = (query: CoverageQuery, signal?: AbortSignal) =>
  apiClient.get<TuningCoverageDto>(`/api/reports/tuning-coverage?${queryString(query)}`, signal);

export const tuningCoverageQueryOptions = (query: CoverageQuery) =>
  queryOptions({ queryKey: reportKeys.tuningCoverage(query), queryFn: ({ signal }) => getTuningCoverage(query, signal), placeholderData: keepPreviousData });

export function useTuningCoverage(query: ReportQuery | null) {
  const coverage: CoverageQuery = query
    ? { from: query.from, to: query.to, ...(query.instrumentId ? { instrumentId: query.instrumentId } : {}) }
    : { from: '', to: '' };
  return useQuery({ ...tuningCoverageQueryOptions(coverage), enabled: query !== null });
}
