import type { AffectedBookingDto, ChangeoverPairsInput, ConfigurationInput, ConfigurationUpdateInput, InstrumentInput, InstrumentUpdateInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, configurationKeys, instrumentAdminKeys, instrumentKeys } from '../../../lib/query-keys';

/** One change staff can make; each has a preview with the same body. */
export type InstrumentChange =
  | { kind: 'create-instrument'; input: InstrumentInput }
  | { kind: 'instrument'; id: string; input: InstrumentUpdateInput }
  | { kind: 'create-configuration'; input: ConfigurationInput }
  | { kind: 'configuration'; id: string; input: ConfigurationUpdateInput }
  | { kind: 'changeover-pairs'; id: string; input: ChangeoverPairsInput };

const at = (id: string) => encodeURIComponent(id);

export function saveInstrumentChange(change: InstrumentChange): Promise<unknown> {
  switch (change.kind) {
    case 'create-instrument': return apiClient.post('/api/instruments', change.input);
    case 'instrument': return apiClient.patch(`/api/instruments/${at(change.id)}`, change.input);
    case 'create-configuration': return apiClient.post('/api/configurations', change.input);
    case 'configuration': return apiClient.patch(`/api/configurations/${at(change.id)}`, change.input);
    case 'changeover-pairs': return apiClient.put(`/api/instruments/${at(change.id)}/changeover-pairs`, change.input);
  }
}

/** The future bookings a change would affect; creations affect none. */
export function previewInstrumentChange(change: InstrumentChange): Promise<AffectedBookingDto[]> {
  const ask = (path: string) => apiClient.post<{ affected: AffectedBookingDto[] }>(path, change.input).then((b) => b.affected);
  switch (change.kind) {
    case 'instrument': return ask(`/api/instruments/${at(change.id)}/preview`);
    case 'configuration': return ask(`/api/configurations/${at(change.id)}/preview`);
    case 'changeover-pairs': return ask(`/api/instruments/${at(change.id)}/changeover-pairs/preview`);
    default: return Promise.resolve([]);
  }
}

export function usePreviewInstrumentChange() {
  return useMutation({ mutationFn: previewInstrumentChange });
}

export function useSaveInstrumentChange() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveInstrumentChange,
    onSuccess: async () => {
      // instruments, configurations and the changeover model feed the calendar and every booking check
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: instrumentAdminKeys.all }),
        queryClient.invalidateQueries({ queryKey: instrumentKeys.all }),
        queryClient.invalidateQueries({ queryKey: configurationKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
