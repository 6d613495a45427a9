import type { BookingDto } from '@femtoslot/shared';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { statusLabels } from '../../../features/bookings/components/booking-details';
import { onGridStatuses, targetLabel } from '../../../features/bookings/lib/calendar-events';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';

export function ZoneToggle(props: { mode: 'facility' | 'viewer'; facilityZone: string; viewerZone: string; onToggle: () => void }) {
  const shown = props.mode === 'facility' ? props.facilityZone : props.viewerZone;
  const other = props.mode === 'facility' ? `your time (${props.viewerZone})` : `facility time (${props.facilityZone})`;
  return (
    <div className="flex items-center gap-2 pb-0.5 text-sm">
      <span className="text-ink-muted">
        Times in <strong className="text-ink" data-testid="shown-zone">{shown}</strong>
        {props.mode === 'facility' ? ' (facility)' : ' (yours)'}
      </span>
      <Button variant="secondary" size="sm" data-testid="zone-toggle" data-zone={props.mode} aria-pressed={props.mode === 'viewer'} onClick={props.onToggle}>
        Show {other}
      </Button>
    </div>
  );
}

/** Staff who drag a range choose what it is for. */
export function SelectionChoice(props: {
  slot: { startsAt: string; endsAt: string } | null;
  timeZone: string;
  onClose: () => void;
  onRequest: (slot: { startsAt: string; endsAt: string }) => void;
  onMaintenance: (slot: { startsAt: string; endsAt: string }) => void;
}) {
  const { slot } = props;
  return (
    <Dialog
      open={slot !== null}
      onClose={props.onClose}
      title="Use this time for…"
      testId="selection-choice"
      description={slot ? `${formatInstant(slot.startsAt, props.timeZone)} · ${formatMinutes(minutesBetween(slot.startsAt, slot.endsAt))}` : undefined}
    >
      {slot && (
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" data-testid="choose-maintenance" onClick={() => props.onMaintenance(slot)}>
            Block maintenance
          </Button>
          <Button data-testid="choose-request" onClick={() => props.onRequest(slot)}>
            Request beam time
          </Button>
        </div>
      )}
    </Dialog>
  );
}

/** Displaced, cancelled and declined bookings in view: kept off the grid, listed here. */
export function NotOnGrid(props: {
  bookings: BookingDto[];
  timeZone: string;
  configurationName: (id: string, outputKind: string) => string;
  onOpen: (booking: BookingDto) => void;
}) {
  const off = props.bookings.filter((b) => !onGridStatuses.has(b.status) && b.detail);
  if (off.length === 0) return null;
  return (
    <section className="rounded-xl border border-line bg-panel px-4 py-3" data-testid="not-on-grid">
      <h2 className="text-sm font-semibold">Not on the grid in this view</h2>
      <ul className="mt-2 divide-y divide-line text-sm">
        {off.map((b) => (
          <li key={b.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5" data-booking-id={b.id} data-status={b.status}>
            <button type="button" className="text-left hover:underline" onClick={() => props.onOpen(b)}>
              {props.configurationName(b.configurationId, b.outputKind)} · {targetLabel(b.detail!)} · {formatInstant(b.startsAt, props.timeZone)}
            </button>
            <span className="text-xs font-semibold text-ink-muted">{statusLabels[b.status]}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
