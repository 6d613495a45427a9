import { requiredOdBandsSchema } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TableShell } from '../../../components/ui/table-shell';
import type { Configuration } from '../api/get-configurations';
import { useUpdateConfiguration } from '../api/update-configuration';
import { OdBandsField, odBandsText } from './od-bands-field';

/** The minimum eyewear OD per wavelength band and configuration, as the facility's laser-safety officer sets them. */
export interface RequiredOdTableProps {
  instruments: { id: string; name: string }[];
  configurations: Configuration[];
  loading: boolean;
  error: string | null;
}

export function RequiredOdTable({ instruments, configurations: rows, loading, error }: RequiredOdTableProps) {
  const instrumentName = (id: string) => instruments.find((i) => i.id === id)?.name ?? '';
  return (
    <section className="space-y-2" aria-labelledby="required-od-title" data-testid="required-od">
      <h2 id="required-od-title" className="font-semibold">
        Required optical density per configuration and wavelength band
      </h2>
      <p className="text-sm text-ink-muted">
        Set by the facility's laser-safety officer from the output's power and exposure limits (ANSI Z136.1 / IEC 60825-1). Femtoslot
        only compares eyewear ratings with these values at every wavelength on the table (where bands overlap, the higher OD
        applies); it does not compute them.
      </p>
      {error && <p className="text-sm text-danger">{error}</p>}
      <TableShell caption="Required OD per configuration" isEmpty={!loading && !error && rows.length === 0} empty="No configurations yet.">
        <thead className="border-b border-line bg-sunk text-xs tracking-wide text-ink-muted uppercase">
          <tr>
            <th className="px-4 py-2">Configuration</th>
            <th className="px-4 py-2">Instrument</th>
            <th className="px-4 py-2">Tuning range</th>
            <th className="px-4 py-2">Required OD per band</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((configuration) => (
            <OdRow key={configuration.id} configuration={configuration} instrument={instrumentName(configuration.instrumentId)} />
          ))}
        </tbody>
      </TableShell>
    </section>
  );
}

function OdRow({ configuration, instrument }: { configuration: Configuration; instrument: string }) {
  const update = useUpdateConfiguration();
  const [bands, setBands] = useState(configuration.requiredOdBands);
  const parsed = requiredOdBandsSchema.safeParse(bands);
  const changed = parsed.success && JSON.stringify(parsed.data) !== JSON.stringify(configuration.requiredOdBands);
  return (
    <tr className="border-b border-line align-top last:border-0" data-testid="required-od-row" data-configuration-id={configuration.id}>
      <td className="px-4 py-2 font-medium">{configuration.name}</td>
      <td className="px-4 py-2 text-ink-muted">{instrument}</td>
      <td className="px-4 py-2 tabular-nums text-ink-muted">
        {configuration.minNm}–{configuration.maxNm} nm
      </td>
      <td className="space-y-1.5 px-4 py-2">
        <OdBandsField label={`Required OD for ${configuration.name}`} value={bands} onChange={setBands} />
        {!parsed.success && <p className="text-xs font-semibold text-danger">{parsed.error.issues[0]?.message}</p>}
        <Button
          size="sm"
          variant="secondary"
          disabled={!changed}
          busy={update.isPending}
          onClick={() =>
            parsed.success &&
            update.mutate(
              { id: configuration.id, requiredOdBands: parsed.data },
              { onSuccess: () => toast.success(`${configuration.name}: ${odBandsText(parsed.data)}`), onError: (e) => toast.error(e.message) },
            )
          }
        >
          Save
        </Button>
      </td>
    </tr>
  );
}
