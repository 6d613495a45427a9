import type { InstrumentAdminDto } from '@femtoslot/shared';
import { outputKindLabels } from '@femtoslot/shared';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { StatusPill } from '../../../components/ui/status-pill';
import { odBandsText } from '../../../features/instruments/components/od-bands-field';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useManagedInstruments } from '../../../features/instruments/api/get-managed-instruments';
import { ChangeoverMatrix } from '../../../features/instruments/components/changeover-matrix';
import { ConfigurationForm } from '../../../features/instruments/components/configuration-form';
import { InstrumentForm } from '../../../features/instruments/components/instrument-form';
import { cx } from '../../../lib/cx';

type Editing = { kind: 'configuration'; id: string | null } | null;

function ConfigurationsTable({ instrument, timeZone }: { instrument: InstrumentAdminDto; timeZone: string }) {
  const [editing, setEditing] = useState<Editing>(null);
  return (
    <div className="space-y-2">
      <div className="overflow-x-auto rounded-lg border border-line">
        <table className="w-full text-left text-sm" data-testid="configurations-table">
          <caption className="sr-only">Configurations of {instrument.name}</caption>
          <thead className="border-b border-line bg-sunk text-xs tracking-wide text-ink-muted uppercase">
            <tr>
              <th className="px-3 py-2">Configuration</th>
              <th className="px-3 py-2">Output</th>
              <th className="px-3 py-2">Tuning range</th>
              <th className="px-3 py-2">Required OD (laser-safety officer)</th>
              <th className="px-3 py-2" />
            </tr>
          </thead>
          <tbody>
            {instrument.configurations.map((c) => (
              <tr key={c.id} className="border-b border-line last:border-0" data-testid="configuration-row" data-key={c.key}>
                <td className="px-3 py-2 font-medium">
                  {c.name} {!c.active && <StatusPill tone="neutral">inactive</StatusPill>}
                </td>
                <td className="px-3 py-2 text-ink-muted">{outputKindLabels[c.outputKind]}</td>
                <td className="px-3 py-2 tabular-nums text-ink-muted">
                  {c.minNm}–{c.maxNm} nm (default {c.defaultNm})
                </td>
                <td className="px-3 py-2 text-xs text-ink-muted">{odBandsText(c.requiredOdBands)}</td>
                <td className="px-3 py-2 text-right">
                  <Button size="sm" variant="quiet" data-testid="edit-configuration" onClick={() => setEditing({ kind: 'configuration', id: c.id })}>
                    Edit
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {editing ? (
        <ConfigurationForm
          key={editing.id ?? 'new'}
          instrumentId={instrument.id}
          configuration={instrument.configurations.find((c) => c.id === editing.id) ?? null}
          timeZone={timeZone}
          onSaved={() => setEditing(null)}
        />
      ) : (
        <Button size="sm" variant="secondary" data-testid="add-configuration" onClick={() => setEditing({ kind: 'configuration', id: null })}>
          Add configuration
        </Button>
      )}
    </div>
  );
}

function InstrumentPanel({ instrument, timeZone }: { instrument: InstrumentAdminDto; timeZone: string }) {
  return (
    <div className="space-y-6" data-testid="instrument-panel" data-instrument-id={instrument.id}>
      <section className="space-y-2">
        <h2 className="font-semibold">Instrument</h2>
        <InstrumentForm key={instrument.id} instrument={instrument} timeZone={timeZone} />
      </section>
      <section className="space-y-2">
        <h2 className="font-semibold">Configurations</h2>
        <ConfigurationsTable instrument={instrument} timeZone={timeZone} />
      </section>
      <section className="space-y-2">
        <h2 className="font-semibold">Changeover minutes between configurations</h2>
        <ChangeoverMatrix key={`${instrument.id}:${JSON.stringify(instrument.changeoverPairs)}`} instrument={instrument} timeZone={timeZone} />
      </section>
    </div>
  );
}

/** Staff and admins keep the facility's sources and benches, their outputs and the changeover model here. */
export function SourcesPage() {
  const instruments = useManagedInstruments();
  const facility = useFacility();
  const [selected, setSelected] = useState<string | 'new' | null>(null);
  if (instruments.isPending) return <PageLoading />;
  if (instruments.error) return <p className="text-sm text-danger">{instruments.error.message}</p>;
  const list = instruments.data;
  const current = selected === 'new' ? null : (list.find((i) => i.id === selected) ?? list[0] ?? null);
  const timeZone = facility.data?.timeZone ?? 'UTC';
  return (
    <>
      <PageHeader
        title="Sources & stations"
        lead="The tunable sources and measurement benches, their configurations, the OD bands the laser-safety officer set, and the changeover model. Every change is checked against the future bookings first."
        actions={
          <Button size="sm" data-testid="add-instrument" onClick={() => setSelected('new')}>
            Add instrument
          </Button>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[14rem_1fr]">
        <nav aria-label="Instruments" className="space-y-1" data-testid="instrument-list">
          {list.map((i) => (
            <button
              key={i.id}
              type="button"
              onClick={() => setSelected(i.id)}
              aria-current={current?.id === i.id && selected !== 'new' ? 'true' : undefined}
              className={cx(
                'block w-full rounded-lg border px-3 py-2 text-left text-sm',
                current?.id === i.id && selected !== 'new' ? 'border-accent bg-accent-soft' : 'border-line hover:bg-sunk',
              )}
            >
              <span className="block font-semibold">{i.name}</span>
              <span className="text-xs text-ink-muted">
                {i.kind === 'source' ? 'Source' : 'Bench'} · {i.configurations.length} configuration{i.configurations.length === 1 ? '' : 's'}
                {!i.active && ' · inactive'}
              </span>
            </button>
          ))}
        </nav>
        <div className="max-w-4xl space-y-4">
          {selected === 'new' ? (
            <section className="space-y-2">
              <h2 className="font-semibold">New instrument</h2>
              <InstrumentForm instrument={null} timeZone={timeZone} onSaved={() => setSelected(null)} />
            </section>
          ) : current ? (
            <InstrumentPanel instrument={current} timeZone={timeZone} />
          ) : (
            <p className="text-sm text-ink-muted">No instruments yet.</p>
          )}
          <LaserCaution />
        </div>
      </div>
    </>
  );
}
