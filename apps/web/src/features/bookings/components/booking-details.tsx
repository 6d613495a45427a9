import type { BookingDto } from '@femtoslot/shared';
import { type ReactNode, useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { fieldsToInstant, formatInstant, formatMinutes, instantToFields, minutesBetween } from '../../../lib/wall-time';
import { useApproveBooking } from '../api/approve-booking';
import { useBooking } from '../api/get-booking';
import { useMoveBooking } from '../api/move-booking';
import { targetLabel } from '../lib/calendar-events';
import { type CancellationFee, type CancellationWindows, cancellationFee } from '../lib/cancellation-fee';
import { changeoverGapDetails } from '../lib/changeover-gap';
import { CancelAction, DeclineAction } from './booking-actions';

export const statusLabels: Record<BookingDto['status'], string> = {
  requested: 'Awaiting staff approval',
  approved: 'Approved',
  declined: 'Declined',
  completed: 'Completed',
  cancelled: 'Cancelled',
  displaced: 'Displaced by maintenance',
};

export interface BookingDetailsProps {
  booking: BookingDto | null;
  onClose: () => void;
  timeZone: string;
  /** the zone the facility keeps; moves are typed in it */
  facilityTimeZone: string;
  isStaff: boolean;
  viewerOrganisationId: string;
  windows: CancellationWindows;
  configurationName: (configurationId: string, outputKind: string) => string;
  /** instrument id → name, for the end stations */
  instrumentName?: (instrumentId: string) => string;
}

export function BookingDetails(props: BookingDetailsProps) {
  return (
    <Dialog open={props.booking !== null} onClose={props.onClose} title="Booking" testId="booking-details-dialog">
      {props.booking && <BookingDetailsBody {...props} booking={props.booking} />}
    </Dialog>
  );
}

function Row({ label, children, testId }: { label: string; children: ReactNode; testId?: string }) {
  return (
    <div className="grid grid-cols-[8rem_1fr] gap-3 py-1.5" data-testid={testId}>
      <dt className="text-ink-muted">{label}</dt>
      <dd className="font-medium">{children}</dd>
    </div>
  );
}

function BookingDetailsBody(props: BookingDetailsProps & { booking: BookingDto }) {
  const fresh = useBooking(props.booking.id);
  const booking = fresh.data?.booking ?? props.booking;
  const audit = fresh.data?.audit;
  const { timeZone, isStaff } = props;
  const detail = booking.detail;
  const ownOrganisation = booking.own || detail?.organisationId === props.viewerOrganisationId;
  const live = booking.status === 'requested' || booking.status === 'approved';
  const canCancel = live && (ownOrganisation || isStaff);
  // A request staff have not approved yet is withdrawn at no cost (the API stores 0 % for it).
  const fee: CancellationFee = booking.status === 'requested'
    ? { percent: 0, changesAt: null, summary: 'Free: a request that staff have not approved yet can be withdrawn at no cost.' }
    : cancellationFee(booking.startsAt, new Date(), props.windows);
  const name = props.configurationName(booking.configurationId, booking.outputKind);

  return (
    <div data-testid="booking-details" data-booking-id={booking.id} data-status={booking.status} className="space-y-4 text-sm">
      <dl className="divide-y divide-line">
        <Row label="Configuration">{detail ? name : `Busy · ${name}`}</Row>
        <Row label="Status" testId="booking-status">
          {statusLabels[booking.status]}
        </Row>
        {(booking.stationIds?.length ?? 0) > 0 && (
          <Row label="End stations" testId="booking-stations">
            {booking.stationIds!.map((id) => props.instrumentName?.(id) ?? id).join(', ')}
          </Row>
        )}
        <Row label="When">
          {formatInstant(booking.startsAt, timeZone)} – {formatInstant(booking.endsAt, timeZone).split(', ').pop()} ({formatMinutes(minutesBetween(booking.startsAt, booking.endsAt))},{' '}
          {timeZone})
        </Row>
        {detail && (
          <>
            <Row label="Target">{targetLabel(detail)}</Row>
            <Row label="Purpose">{detail.purpose}</Row>
            <Row label="Booked by">
              {detail.userName} · {detail.organisationName}
            </Row>
            <Row label="Account">{detail.accountName}</Row>
            {detail.changeoverBeforeMinutes !== null && <Row label="Changeover before">⟳ {detail.changeoverBeforeMinutes} min</Row>}
            {detail.declineReason && <Row label="Declined because">{detail.declineReason}</Row>}
            {detail.cancellationFeePercent !== null && <Row label="Cancellation fee">{detail.cancellationFeePercent} %</Row>}
          </>
        )}
      </dl>
      {!detail && <p className="text-ink-muted">This time is held by another organisation; only busy/free is shown.</p>}

      {isStaff && booking.status === 'requested' && <ApproveDecline bookingId={booking.id} onDone={props.onClose} />}
      {isStaff && live && <MoveAction booking={booking} timeZone={props.facilityTimeZone} />}
      {canCancel && <CancelAction bookingId={booking.id} fee={fee} timeZone={timeZone} onDone={props.onClose} />}

      {isStaff && audit && audit.length > 0 && (
        <details data-testid="booking-audit" className="rounded-lg border border-line px-3 py-2">
          <summary className="cursor-pointer font-semibold">History ({audit.length})</summary>
          <ol className="mt-2 space-y-1">
            {audit.map((entry, index) => (
              <li key={`${entry.createdAt}-${index}`} className="text-ink-muted">
                <span className="font-medium text-ink">{entry.action}</span> by {entry.actorName} · {formatInstant(entry.createdAt, timeZone)}
              </li>
            ))}
          </ol>
        </details>
      )}
    </div>
  );
}

function ApproveDecline({ bookingId, onDone }: { bookingId: string; onDone: () => void }) {
  const approve = useApproveBooking();
  return (
    <div className="flex flex-wrap items-start gap-2">
      <Button
        data-testid="approve-booking"
        busy={approve.isPending}
        onClick={() =>
          approve.mutate(
            { id: bookingId },
            { onSuccess: () => (toast.success('Request approved'), onDone()), onError: (e) => toast.error(e.message) },
          )
        }
      >
        Approve
      </Button>
      <DeclineAction bookingId={bookingId} onDone={onDone} />
    </div>
  );
}

function MoveAction({ booking, timeZone }: { booking: BookingDto; timeZone: string }) {
  const move = useMoveBooking();
  const [open, setOpen] = useState(false);
  const [start, setStart] = useState(() => instantToFields(booking.startsAt, timeZone));
  const [end, setEnd] = useState(() => instantToFields(booking.endsAt, timeZone));
  const [problem, setProblem] = useState<string | null>(null);
  if (!open) {
    return (
      <Button variant="secondary" size="sm" data-testid="move-booking" onClick={() => setOpen(true)}>
        Move…
      </Button>
    );
  }
  const startsAt = fieldsToInstant(start, timeZone);
  const endsAt = fieldsToInstant(end, timeZone);
  const submit = () => {
    if (!startsAt || !endsAt) return setProblem('Fill in both dates and times.');
    move.mutate(
      { id: booking.id, startsAt: startsAt.instant.toISOString(), endsAt: endsAt.instant.toISOString() },
      {
        onSuccess: () => (toast.success('Booking moved'), setOpen(false)),
        onError: (error) => {
          const gap = isApiError(error) ? changeoverGapDetails(error.details) : null;
          setProblem(
            gap
              ? `Needed ${formatMinutes(gap.neededMinutes)} of changeover, ${formatMinutes(gap.availableMinutes)} available${gap.earliestStart ? `; earliest start ${formatInstant(gap.earliestStart, timeZone)}` : ''}.`
              : error.message,
          );
        },
      },
    );
  };
  return (
    <fieldset className="space-y-3 rounded-lg border border-line p-3" data-testid="move-form">
      <legend className="px-1 font-semibold">Move to ({timeZone})</legend>
      <div className="grid grid-cols-2 gap-2">
        <TextField label="Start date" type="date" name="startDate" value={start.date} onChange={(e) => setStart({ ...start, date: e.target.value })} />
        <TextField label="Start time" type="time" name="startTime" value={start.time} onChange={(e) => setStart({ ...start, time: e.target.value })} />
        <TextField label="End date" type="date" name="endDate" value={end.date} onChange={(e) => setEnd({ ...end, date: e.target.value })} />
        <TextField label="End time" type="time" name="endTime" value={end.time} onChange={(e) => setEnd({ ...end, time: e.target.value })} />
      </div>
      {[startsAt?.note, endsAt?.note].filter(Boolean).map((note) => (
        <p key={note} className="text-xs text-ink-muted">
          {note}
        </p>
      ))}
      {problem && <Notice tone="danger">{problem}</Notice>}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" size="sm" onClick={() => setOpen(false)}>
          Keep it
        </Button>
        <Button size="sm" busy={move.isPending} data-testid="confirm-move" onClick={submit}>
          Move booking
        </Button>
      </div>
    </fieldset>
  );
}
