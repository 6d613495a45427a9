import type { RateTable } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { rateCardKeys } from '../../../lib/query-keys';

/** As apps/api/src/modules/rate-cards/rate-cards.service.ts toRateCardDto answers it; amounts in minor units per hour. */
export interface RateCard {
  id: string;
  name: string;
  effectiveFrom: string;
  effectiveTo: string | null;
  currency: string;
  billingIncrementMinutes: number;
  changeoverSharePercent: number;
  minimumChargeMinutes: number;
  rates: RateTable;
}

/** The facility's cancellation windows, sent beside the cards because the fees follow them (kept in facility settings). */
export interface CancellationPolicy {
  cancellationFreeHours: number;
  cancellationHalfFeeHours: number;
  description: string;
}

export interface RateCardsAnswer {
  /** newest first */
  rateCards: RateCard[];
  cancellationPolicy?: CancellationPolicy;
}

/** Finance, admin and staff. */
export const getRateCards = (signal?: AbortSignal) => apiClient.get<RateCardsAnswer>('/api/rate-cards', signal);

export const rateCardsQueryOptions = () => queryOptions({ queryKey: rateCardKeys.list(), queryFn: ({ signal }) => getRateCards(signal) });

export function useRateCards(enabled = true) {
  return useQuery({ ...rateCardsQueryOptions(), enabled });
}
