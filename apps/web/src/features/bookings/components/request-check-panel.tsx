import type { BookingCheckDto, PickerUnit, TableRole } from '@femtoslot/shared';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../lib/cx';
import { formatInstant, formatMinutes } from '../../../lib/wall-time';
import { formatInUnit } from '../lib/target-units';

export const roleLabels: Record<TableRole, string> = {
  pump_residual: 'Pump residual',
  fundamental: 'Fundamental',
  shg: 'SHG',
  signal: 'Signal',
  idler: 'Idler',
  dfg: 'DFG',
};

const nm = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

export function bandText(band: { minNm: number; maxNm: number }, unit: PickerUnit): string {
  const inNm = band.minNm === band.maxNm ? `${nm.format(band.minNm)} nm` : `${nm.format(band.minNm)}–${nm.format(band.maxNm)} nm`;
  if (unit === 'nm') return inNm;
  const other = band.minNm === band.maxNm ? formatInUnit(band.minNm, unit) : `${formatInUnit(band.minNm, unit)} – ${formatInUnit(band.maxNm, unit)}`;
  return `${inNm} (${other})`;
}

/** Wavelengths the engine derives for the chosen output and target (idler, DFG partners, SHG residual…). */
export function DerivedWavelengths({ bands, unit }: { bands: { role: string; minNm: number; maxNm: number }[]; unit: PickerUnit }) {
  return (
    <dl data-testid="derived-wavelengths" className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
      {bands.map((band) => (
        <div key={band.role} className="contents" data-role={band.role}>
          <dt className="font-semibold">{roleLabels[band.role as TableRole] ?? band.role}</dt>
          <dd className="text-ink-muted tabular-nums">{bandText(band, unit)}</dd>
        </div>
      ))}
    </dl>
  );
}

function NeighbourLine({ label, testId, neighbour }: { label: string; testId: string; neighbour: BookingCheckDto['timeline']['before'] }) {
  if (!neighbour) {
    return (
      <p data-testid={testId} data-needed="0" className="text-ink-muted">
        {label}: no neighbour on this instrument.
      </p>
    );
  }
  const short = neighbour.shortfallMinutes > 0;
  return (
    <p data-testid={testId} data-needed={neighbour.neededMinutes} data-available={neighbour.availableMinutes} className={cx(short && 'font-semibold text-danger')}>
      {label}: ⟳ {formatMinutes(neighbour.neededMinutes)} changeover needed, {formatMinutes(neighbour.availableMinutes)} free
      {short ? ` — ${formatMinutes(neighbour.shortfallMinutes)} short` : ' — fits'}.
    </p>
  );
}

export interface RequestCheckPanelProps {
  check: BookingCheckDto | undefined;
  checking: boolean;
  error: string | null;
  timeZone: string;
  onUseEarliest: (earliestStart: string) => void;
}

/** The live dry run: changeover against the neighbours, the earliest start that works, and what else the API found. */
export function RequestCheckPanel({ check, checking, error, timeZone, onUseEarliest }: RequestCheckPanelProps) {
  if (error) return <p className="text-sm text-danger">The check could not run: {error}</p>;
  if (!check) return <p className="text-sm text-ink-muted">{checking ? 'Checking…' : 'Fill in the configuration, target and times to check the request.'}</p>;
  const { timeline } = check;
  const blocked = (timeline.before?.shortfallMinutes ?? 0) > 0 || (timeline.after?.shortfallMinutes ?? 0) > 0 || timeline.overlaps.length > 0;
  const other = check.problems.filter((p) => p.code !== 'changeover_gap' && p.code !== 'overlap');
  return (
    <div className="space-y-2 text-sm" data-testid="request-check" data-ok={check.ok} aria-busy={checking || undefined}>
      <NeighbourLine label="Before" testId="changeover-before" neighbour={timeline.before} />
      <NeighbourLine label="After" testId="changeover-after" neighbour={timeline.after} />
      {timeline.overlaps.length > 0 && <p className="font-semibold text-danger">The time overlaps another booking or a maintenance window.</p>}
      {timeline.earliestStart && (
        <div data-testid="earliest-start" data-earliest-start={timeline.earliestStart} className="flex flex-wrap items-center gap-2">
          <span className={cx(blocked ? 'font-semibold' : 'text-ink-muted')}>
            Earliest feasible start: {formatInstant(timeline.earliestStart, timeZone)}
          </span>
          {blocked && (
            <Button size="sm" variant="secondary" data-testid="use-earliest-start" onClick={() => onUseEarliest(timeline.earliestStart!)}>
              Use {formatInstant(timeline.earliestStart, timeZone).split(', ').pop()}
            </Button>
          )}
        </div>
      )}
      {other.length > 0 && (
        <ul className="list-disc space-y-1 pl-5 text-danger" data-testid="check-problems">
          {other.map((p) => (
            <li key={p.code + p.message} data-code={p.code}>
              {p.message}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
