import type { RateCardInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys, rateCardKeys } from '../../../lib/query-keys';
import type { RateCard } from './get-rate-cards';

/** A new card ends the open-ended one before it; an overlap with any other card is refused (409). */
export const createRateCard = (input: RateCardInput) =>
  apiClient.post<{ rateCard: RateCard }>('/api/rate-cards', input).then((body) => body.rateCard);

export function useCreateRateCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRateCard,
    onSuccess: async () => {
      // an open period's live preview is priced by the cards
      await Promise.all([queryClient.invalidateQueries({ queryKey: rateCardKeys.all }), queryClient.invalidateQueries({ queryKey: billingKeys.all })]);
    },
  });
}
