import type { BookingDto, SlotDto } from '@femtoslot/shared';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import { useCreateBooking } from '../api/create-booking';
import { useNeedsRebooking } from '../api/get-needs-rebooking';
import { targetLabel } from '../lib/calendar-events';

export interface NeedsRebookingPanelProps {
  timeZone: string;
  isStaff: boolean;
  configurationName: (configurationId: string, outputKind: string) => string;
}

/** Bookings displaced by maintenance, each with the engine's three alternatives and a one-click rebook. */
export function NeedsRebookingPanel({ timeZone, isStaff, configurationName }: NeedsRebookingPanelProps) {
  const query = useNeedsRebooking();
  const bookings = query.data ?? [];
  return (
    <section data-testid="needs-rebooking" className="rounded-xl border border-line bg-panel px-4 py-3.5" aria-labelledby="needs-rebooking-title">
      <h2 id="needs-rebooking-title" className="text-sm font-semibold">
        Needs rebooking {bookings.length > 0 && <span className="ml-1 rounded-full bg-danger-soft px-2 text-danger">{bookings.length}</span>}
      </h2>
      <p className="mt-0.5 text-xs text-ink-muted">
        {isStaff ? 'Every booking displaced by maintenance and not yet rebooked.' : "Your organisation's bookings displaced by maintenance."} Displaced time is never charged.
      </p>
      {query.isError && <p className="mt-2 text-sm text-danger">{query.error.message}</p>}
      {query.isSuccess && bookings.length === 0 && <p className="mt-2 text-sm text-ink-muted">Nothing to rebook.</p>}
      <ul className="mt-3 space-y-3">
        {bookings.map((booking) => (
          <DisplacedBooking key={booking.id} booking={booking} timeZone={timeZone} name={configurationName(booking.configurationId, booking.outputKind)} />
        ))}
      </ul>
    </section>
  );
}

function DisplacedBooking({ booking, timeZone, name }: { booking: BookingDto; timeZone: string; name: string }) {
  const create = useCreateBooking();
  const detail = booking.detail;
  const rebook = (slot: SlotDto) => {
    if (!detail) return;
    const target = detail.targetMinNm === detail.targetMaxNm ? { targetNm: detail.targetMinNm } : { minNm: detail.targetMinNm, maxNm: detail.targetMaxNm };
    create.mutate(
      {
        instrumentId: booking.instrumentId,
        configurationId: booking.configurationId,
        startsAt: slot.startsAt,
        endsAt: slot.endsAt,
        ...target,
        accountId: detail.accountId,
        purpose: detail.purpose,
        rebookOf: booking.id,
        // the alternatives were chosen to leave its end stations free too
        ...(booking.stationIds?.length ? { stationIds: booking.stationIds } : {}),
      },
      {
        onSuccess: ({ booking: created }) =>
          toast.success(created.status === 'approved' ? 'Rebooked' : 'Rebooking sent for staff approval', {
            description: formatInstant(created.startsAt, timeZone),
          }),
        onError: (error) => toast.error(isApiError(error) ? `${error.message}` : 'The slot could not be booked'),
      },
    );
  };
  return (
    <li className="rounded-lg border border-line px-3 py-2.5 text-sm" data-testid="displaced-booking" data-booking-id={booking.id}>
      <p className="font-semibold">
        {name}
        {detail && ` · ${targetLabel(detail)}`}
      </p>
      <p className="text-ink-muted">
        Was {formatInstant(booking.startsAt, timeZone)} ({formatMinutes(minutesBetween(booking.startsAt, booking.endsAt))})
        {detail && ` · ${detail.userName}, ${detail.organisationName}`}
      </p>
      {detail && detail.alternatives.length > 0 ? (
        <ul className="mt-2 space-y-1.5">
          {detail.alternatives.map((slot) => (
            <li key={slot.startsAt} className="flex items-center justify-between gap-2">
              <span className="tabular-nums">
                {formatInstant(slot.startsAt, timeZone)} – {formatInstant(slot.endsAt, timeZone).split(', ').pop()}
              </span>
              <Button size="sm" variant="secondary" data-testid="rebook-slot" data-starts-at={slot.startsAt} busy={create.isPending && create.variables?.startsAt === slot.startsAt} disabled={create.isPending} onClick={() => rebook(slot)}>
                Rebook this slot
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-ink-muted">No alternative slot was found within the booking horizon; request a new time.</p>
      )}
    </li>
  );
}
