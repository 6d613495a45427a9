import { formatInstant } from '../../../lib/wall-time';
import type { LeftOutSession } from '../types';

const reasonWords: Record<LeftOutSession['reason'], string> = {
  unlogged: 'No session log',
  log_not_confirmed: 'Log not confirmed by staff',
  not_approved: 'Request never approved',
};

const timeOnly = (instant: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(instant));

/** Bookings of the month that closing will not bill, with who booked them and why they are out. */
export function LeftOutList({ leftOut, timeZone }: { leftOut: LeftOutSession[]; timeZone: string }) {
  return (
    <section data-testid="left-out" data-count={leftOut.length} className="overflow-hidden rounded-xl border border-caution-line/60 bg-panel">
      <header className="border-b border-line bg-caution-bg px-4 py-3 text-caution-ink">
        <h4 className="font-semibold">
          Left out of this statement: {leftOut.length} booking{leftOut.length === 1 ? '' : 's'}
        </h4>
        <p className="text-xs text-ink-muted">
          These bookings start in the month but this close will not bill them, and a later period will not pick them up either (it bills
          the sessions that start in its own month). Ask staff to confirm pending logs before closing where you can.
        </p>
      </header>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">Bookings left out of the statement</caption>
          <thead className="text-xs text-ink-muted">
            <tr>
              <th scope="col" className="px-4 py-2 font-semibold">Why</th>
              <th scope="col" className="px-4 py-2 font-semibold">Beam time ({timeZone})</th>
              <th scope="col" className="px-4 py-2 font-semibold">Booked by</th>
              <th scope="col" className="px-4 py-2 font-semibold">Account</th>
              <th scope="col" className="px-4 py-2 font-semibold">Booking</th>
            </tr>
          </thead>
          <tbody>
            {leftOut.map((l) => (
              <tr key={l.bookingId} data-testid="left-out-row" data-reason={l.reason} className="border-t border-line align-top">
                <td className="px-4 py-2 font-semibold">{reasonWords[l.reason]}</td>
                <td className="whitespace-nowrap px-4 py-2 tabular-nums">
                  {formatInstant(l.startsAt, timeZone)}–{timeOnly(l.endsAt, timeZone)}
                  <span className="block text-xs text-ink-muted">
                    {l.instrumentName}
                    {l.configurationName ? `, ${l.configurationName}` : ''}
                  </span>
                </td>
                <td className="px-4 py-2">
                  {l.userName ?? '—'}
                  {l.userEmail && <span className="block text-xs text-ink-muted">{l.userEmail}</span>}
                </td>
                <td className="px-4 py-2">
                  {l.accountName ?? '—'}
                  {l.organisationName && <span className="block text-xs text-ink-muted">{l.organisationName}</span>}
                </td>
                <td className="px-4 py-2 font-mono text-xs" title={l.bookingId}>
                  {l.bookingId.slice(0, 8)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
