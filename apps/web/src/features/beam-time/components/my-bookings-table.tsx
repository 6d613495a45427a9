import type { BookingDto } from '@femtoslot/shared';
import { Link } from 'react-router-dom';
import { ConfigurationChip } from '../../../components/ui/configuration-chip';
import { type PillTone, StatusPill } from '../../../components/ui/status-pill';
import { TableShell } from '../../../components/ui/table-shell';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import type { MyBooking } from '../api/get-my-beam-time';

const statusWords: Record<BookingDto['status'], { label: string; tone: PillTone }> = {
  requested: { label: 'Requested — awaiting staff', tone: 'caution' },
  approved: { label: 'Approved', tone: 'success' },
  declined: { label: 'Declined', tone: 'danger' },
  completed: { label: 'Completed', tone: 'neutral' },
  cancelled: { label: 'Cancelled', tone: 'neutral' },
  displaced: { label: 'Displaced by maintenance', tone: 'danger' },
};

const nm = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

export interface MyBookingsTableProps {
  bookings: MyBooking[];
  /** the zone the times are shown in (facility or viewer, as the page's toggle says) */
  timeZone: string;
  /** the other zone, shown smaller beneath each time when it differs */
  otherTimeZone: string;
  /** where a row's "Details" link goes */
  detailsHref: (bookingId: string) => string;
}

/** The caller's upcoming bookings and requests with their status, times in both zones, and a link to the details. */
export function MyBookingsTable({ bookings, timeZone, otherTimeZone, detailsHref }: MyBookingsTableProps) {
  const bothZones = timeZone !== otherTimeZone;
  return (
    <TableShell caption="My upcoming beam time" testId="my-bookings" isEmpty={bookings.length === 0} empty="No upcoming beam time. Request some from the calendar.">
      <thead className="border-b border-line bg-sunk text-xs uppercase tracking-wide text-ink-muted">
        <tr>
          <th className="px-4 py-2 font-semibold">When</th>
          <th className="px-4 py-2 font-semibold">Instrument and configuration</th>
          <th className="px-4 py-2 font-semibold">Target</th>
          <th className="px-4 py-2 font-semibold">Status</th>
          <th className="px-4 py-2"><span className="sr-only">Details</span></th>
        </tr>
      </thead>
      <tbody>
        {bookings.map((b) => {
          const status = statusWords[b.status];
          return (
            <tr key={b.id} data-testid="my-booking-row" data-status={b.status} className="border-b border-line last:border-0 align-top">
              <td className="px-4 py-3">
                <time dateTime={b.startsAt} className="font-medium" data-testid="my-booking-when">{formatInstant(b.startsAt, timeZone, true)}</time>
                <span className="block text-xs text-ink-muted">
                  {formatMinutes(minutesBetween(b.startsAt, b.endsAt))}
                  {bothZones && <> · <span data-testid="my-booking-other-zone">{formatInstant(b.startsAt, otherTimeZone, true)}</span></>}
                </span>
              </td>
              <td className="px-4 py-3">
                <span className="block text-xs text-ink-muted">{b.instrumentName}</span>
                <ConfigurationChip name={b.configurationName || b.configurationKey} outputKind={b.outputKind} />
              </td>
              <td className="whitespace-nowrap px-4 py-3 tabular-nums">
                {b.detail ? (b.detail.targetMinNm === b.detail.targetMaxNm ? `${nm.format(b.detail.targetMinNm)} nm` : `${nm.format(b.detail.targetMinNm)}–${nm.format(b.detail.targetMaxNm)} nm`) : '—'}
              </td>
              <td className="px-4 py-3">
                <StatusPill tone={status.tone}>{status.label}</StatusPill>
                {b.detail?.declineReason && <span className="mt-1 block text-xs text-ink-muted">Reason: {b.detail.declineReason}</span>}
              </td>
              <td className="px-4 py-3 text-right">
                <Link to={detailsHref(b.id)} data-testid="my-booking-details" className="rounded-lg px-2.5 py-1 text-sm font-semibold text-accent hover:bg-sunk">
                  Details
                </Link>
              </td>
            </tr>
          );
        })}
      </tbody>
    </TableShell>
  );
}
