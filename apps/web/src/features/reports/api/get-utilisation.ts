import type { UtilisationReportDto } from '@femtoslot/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { type ReportQuery, reportKeys } from '../../../lib/query-keys';
import { queryString } from '../lib/report-query';

/** Booked, logged, maintenance and changeover hours per period and instrument (a PI sees their own group). */
export const getUtilisation = (query: ReportQuery, signal?: AbortSignal) =>
  apiClient.get<UtilisationReportDto>(`/api/reports/utilisation?${queryString(query)}`, signal);

export const utilisationQueryOptions = (query: ReportQuery) =>
  queryOptions({ queryKey: reportKeys.utilisation(query), queryFn: ({ signal }) => getUtilisation(query, signal), placeholderData: keepPreviousData });

export function useUtilisation(query: ReportQuery | null) {
  return useQuery({ ...utilisationQueryOptions(query ?? { from: '', to: '', groupBy: 'week' }), enabled: query !== null });
}
