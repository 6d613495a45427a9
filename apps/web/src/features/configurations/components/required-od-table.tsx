import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TableShell } from '../../../components/ui/table-shell';
import type { Configuration } from '../api/get-configurations';
import { useUpdateConfiguration } from '../api/update-configuration';

/** The minimum eyewear OD per configuration, as the facility's laser-safety officer sets it. */
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
        Required optical density per configuration
      </h2>
      <p className="text-sm text-ink-muted">
        Set by the facility's laser-safety officer from the output's power and exposure limits (ANSI Z136.1 / IEC 60825-1). Femtoslot
        only compares eyewear ratings with these values; it does not compute them.
      </p>
      {error && <p className="text-sm text-danger">{error}</p>}
      <TableShell caption="Required OD per configuration" isEmpty={!loading && !error && rows.length === 0} empty="No configurations yet.">
        <thead className="border-b border-line bg-sunk text-xs tracking-wide text-ink-muted uppercase">
          <tr>
            <th className="px-4 py-2">Configuration</th>
            <th className="px-4 py-2">Instrument</th>
            <th className="px-4 py-2">Tuning range</th>
            <th className="px-4 py-2">Required OD</th>
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
  const [value, setValue] = useState(String(configuration.requiredOd));
  const parsed = Number(value);
  const valid = value.trim() !== '' && Number.isFinite(parsed) && parsed >= 0 && parsed <= 12;
  const changed = valid && parsed !== configuration.requiredOd;
  return (
    <tr className="border-b border-line last:border-0" data-testid="required-od-row" data-configuration-id={configuration.id}>
      <td className="px-4 py-2 font-medium">{configuration.name}</td>
      <td className="px-4 py-2 text-ink-muted">{instrument}</td>
      <td className="px-4 py-2 tabular-nums text-ink-muted">
        {configuration.minNm}–{configuration.maxNm} nm
      </td>
      <td className="px-4 py-2">
        <div className="flex items-center gap-2">
          <input
            type="number"
            min={0}
            max={12}
            step={0.5}
            aria-label={`Required OD for ${configuration.name}`}
            name="requiredOd"
            value={value}
            onChange={(e) => setValue(e.target.value)}
            className="w-20 rounded-lg border border-line bg-panel px-2 py-1 text-sm tabular-nums"
          />
          <Button
            size="sm"
            variant="secondary"
            disabled={!changed}
            busy={update.isPending}
            onClick={() =>
              update.mutate(
                { id: configuration.id, requiredOd: parsed },
                { onSuccess: () => toast.success(`${configuration.name}: OD ≥ ${parsed}`), onError: (e) => toast.error(e.message) },
              )
            }
          >
            Save
          </Button>
        </div>
      </td>
    </tr>
  );
}
