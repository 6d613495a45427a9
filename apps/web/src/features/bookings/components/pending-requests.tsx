import type { BookingDto } from '@femtoslot/shared';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import { useApproveBooking } from '../api/approve-booking';
import { usePendingBookings } from '../api/get-pending';
import { targetLabel } from '../lib/calendar-events';
import { DeclineAction } from './booking-actions';

export interface PendingRequestsProps {
  timeZone: string;
  configurationName: (configurationId: string, outputKind: string) => string;
  onOpen: (booking: BookingDto) => void;
}

/** Staff: requests awaiting approval, oldest first as the API sends them. */
export function PendingRequests({ timeZone, configurationName, onOpen }: PendingRequestsProps) {
  const query = usePendingBookings();
  const bookings = query.data ?? [];
  return (
    <section data-testid="pending-requests" className="rounded-xl border border-line bg-panel px-4 py-3.5" aria-labelledby="pending-title">
      <h2 id="pending-title" className="text-sm font-semibold">
        Requests awaiting approval {bookings.length > 0 && <span className="ml-1 rounded-full bg-accent-soft px-2 text-accent">{bookings.length}</span>}
      </h2>
      {query.isError && <p className="mt-2 text-sm text-danger">{query.error.message}</p>}
      {query.isSuccess && bookings.length === 0 && <p className="mt-2 text-sm text-ink-muted">No requests waiting.</p>}
      <ul className="mt-3 space-y-3">
        {bookings.map((booking) => (
          <PendingRow key={booking.id} booking={booking} timeZone={timeZone} name={configurationName(booking.configurationId, booking.outputKind)} onOpen={onOpen} />
        ))}
      </ul>
    </section>
  );
}

function PendingRow({ booking, timeZone, name, onOpen }: { booking: BookingDto; timeZone: string; name: string; onOpen: (b: BookingDto) => void }) {
  const approve = useApproveBooking();
  const detail = booking.detail;
  return (
    <li className="space-y-2 rounded-lg border border-line px-3 py-2.5 text-sm" data-testid="pending-request" data-booking-id={booking.id}>
      <button type="button" className="text-left" onClick={() => onOpen(booking)}>
        <span className="block font-semibold underline-offset-2 hover:underline">
          {name}
          {detail && ` · ${targetLabel(detail)}`}
        </span>
        <span className="block text-ink-muted">
          {formatInstant(booking.startsAt, timeZone)} · {formatMinutes(minutesBetween(booking.startsAt, booking.endsAt))}
          {detail && ` · ${detail.userName} (${detail.organisationName})`}
        </span>
      </button>
      <div className="flex flex-wrap gap-2">
        <Button
          size="sm"
          data-testid="approve-booking"
          busy={approve.isPending}
          onClick={() => approve.mutate({ id: booking.id }, { onSuccess: () => toast.success('Request approved'), onError: (e) => toast.error(e.message) })}
        >
          Approve
        </Button>
        <DeclineAction bookingId={booking.id} />
      </div>
    </li>
  );
}
