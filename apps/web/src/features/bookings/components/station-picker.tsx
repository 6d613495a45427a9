import type { StationDto } from '@femtoslot/shared';
import { useEffect } from 'react';
import { type UseFormReturn, useWatch } from 'react-hook-form';
import { useStations } from '../api/get-stations';
import type { RequestFormValues } from '../lib/request-form-values';

/** The stations the configuration can feed, in the order listed. */
export function compatibleStations(stations: StationDto[], configurationId: string): StationDto[] {
  return stations.filter((s) => s.configurationIds.includes(configurationId));
}

/**
 * End stations booked with the source for the same interval: only those the chosen configuration can feed are
 * offered, and a change of configuration drops the ones it cannot feed.
 */
export function StationPicker({ form }: { form: UseFormReturn<RequestFormValues> }) {
  const stations = useStations();
  const configurationId = useWatch({ control: form.control, name: 'configurationId' });
  const chosen = useWatch({ control: form.control, name: 'stationIds' }) ?? [];
  const offered = compatibleStations(stations.data ?? [], configurationId);
  const offeredKey = offered.map((s) => s.id).join(',');

  useEffect(() => {
    if (!stations.data) return;
    const kept = chosen.filter((id) => offered.some((s) => s.id === id));
    if (kept.length !== chosen.length) form.setValue('stationIds', kept);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when what is offered changes
  }, [offeredKey, stations.data]);

  if (stations.isPending || (stations.data ?? []).length === 0) return null;
  const toggle = (id: string, on: boolean) =>
    form.setValue('stationIds', on ? [...chosen, id] : chosen.filter((x) => x !== id), { shouldDirty: true });

  return (
    <fieldset className="rounded-lg border border-line px-3 py-2.5" data-testid="station-picker">
      <legend className="px-1 text-sm font-semibold">End stations</legend>
      {offered.length === 0 ? (
        <p className="text-xs text-ink-muted" data-testid="no-station">
          No end station takes this configuration; the beam stays on the source table.
        </p>
      ) : (
        <div className="space-y-1.5">
          {offered.map((s) => (
            <label key={s.id} className="flex items-start gap-2 text-sm">
              <input
                type="checkbox"
                className="mt-0.5"
                data-testid="station-option"
                data-station-id={s.id}
                checked={chosen.includes(s.id)}
                onChange={(e) => toggle(s.id, e.target.checked)}
              />
              <span>
                <span className="font-medium">{s.name}</span>
                {s.description && <span className="block text-xs text-ink-muted">{s.description}</span>}
              </span>
            </label>
          ))}
          <p className="text-xs text-ink-muted">Booked for the same time as the beam, fed by this configuration, and included in its price.</p>
        </div>
      )}
    </fieldset>
  );
}
