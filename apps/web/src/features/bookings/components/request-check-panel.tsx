import type { BookingCheckDto, PickerUnit, TableRole } from '@femtoslot/shared';
import { formatInstantsIn } from '@femtoslot/shared/time/format-instant';
import { cx } from '../../../lib/cx';
import { formatMinutes, viewerTimeZone } from '../../../lib/wall-time';
import { requestVerdict } from '../lib/request-verdict';
import { formatInUnit } from '../lib/target-units';
import { RequestVerdictLine } from './request-verdict';

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
  return (
    <p data-testid={testId} data-needed={neighbour.neededMinutes} data-available={neighbour.availableMinutes} className={cx(neighbour.shortfallMinutes > 0 ? 'text-danger' : 'text-ink-muted')}>
      {label}: ⟳ {formatMinutes(neighbour.neededMinutes)} changeover needed, {formatMinutes(neighbour.availableMinutes)} free.
    </p>
  );
}

export interface RequestCheckPanelProps {
  check: BookingCheckDto | undefined;
  checking: boolean;
  error: string | null;
  /** the facility's zone */
  timeZone: string;
  onUseEarliest: (earliestStart: string) => void;
}

/**
 * The live dry run: one verdict (see requestVerdict), the changeover against each neighbour as figures, and what else
 * the API found. Beside an overlap the neighbour figures would mislead (they skip the overlapped block), so they go.
 */
export function RequestCheckPanel({ check, checking, error, timeZone, onUseEarliest }: RequestCheckPanelProps) {
  if (error) return <p className="text-sm text-danger">The check could not run: {error}</p>;
  if (!check) return <p className="text-sm text-ink-muted">{checking ? 'Checking…' : 'Fill in the configuration, target and times to check the request.'}</p>;
  const verdict = requestVerdict(check);
  const other = check.problems.filter((p) => p.code !== 'changeover_gap' && p.code !== 'overlap');
  const overlapping = verdict.kind === 'overlap' || verdict.kind === 'maintenance';
  return (
    <div className="space-y-2 text-sm" data-testid="request-check" data-ok={check.ok} data-verdict={verdict.kind} aria-busy={checking || undefined}>
      <RequestVerdictLine verdict={verdict} timeZone={timeZone} onUseEarliest={onUseEarliest} />
      {!overlapping && (
        <>
          <NeighbourLine label="Before" testId="changeover-before" neighbour={check.timeline.before} />
          <NeighbourLine label="After" testId="changeover-after" neighbour={check.timeline.after} />
        </>
      )}
      {other.length > 0 && (
        <ul className="list-disc space-y-1 pl-5 text-danger" data-testid="check-problems">
          {other.map((p) => (
            <li key={p.code + p.message} data-code={p.code}>
              {formatInstantsIn(p.message, timeZone, viewerTimeZone())}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
