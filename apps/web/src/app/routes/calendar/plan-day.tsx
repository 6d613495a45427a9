import { localDate } from '@femtoslot/shared/time/zoned-time';
import { useCallback, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useCalendar } from '../../../features/bookings/api/get-calendar';
import { targetLabel } from '../../../features/bookings/lib/calendar-events';
import { PlanDayPanel } from '../../../features/planner/components/plan-day-panel';
import { useSignedInUser } from '../../../lib/auth';
import { fieldsToInstant } from '../../../lib/wall-time';
import { useBeamTimeData } from './use-beam-time-data';

/** The facility day [00:00, next 00:00) as instants; 23 or 25 h long on DST change days (IANA tz database). */
function dayRange(date: string, timeZone: string): { from: string; to: string } | null {
  const start = fieldsToInstant({ date, time: '00:00' }, timeZone);
  if (!start) return null;
  const next = new Date(`${date}T12:00:00Z`);
  next.setUTCDate(next.getUTCDate() + 1);
  const end = fieldsToInstant({ date: next.toISOString().slice(0, 10), time: '00:00' }, timeZone);
  return end ? { from: start.instant.toISOString(), to: end.instant.toISOString() } : null;
}

export function PlanDayPage() {
  const user = useSignedInUser();
  const data = useBeamTimeData();
  const [pickedInstrumentId, setInstrumentId] = useState<string | null>(null);
  const [pickedDate, setDate] = useState<string | null>(null);
  const timeZone = data.facility.data?.timeZone ?? 'UTC';
  const instrumentId = pickedInstrumentId ?? data.defaultInstrumentId;
  const date = pickedDate ?? localDate(new Date(Date.now() + 86_400_000), timeZone);
  const range = useMemo(() => dayRange(date, timeZone), [date, timeZone]);
  const calendar = useCalendar(range && instrumentId && data.facility.data ? { ...range, instrumentId } : null);
  const bookings = calendar.data?.bookings;
  const describe = useCallback(
    (bookingId: string) => {
      const booking = bookings?.find((b) => b.id === bookingId);
      if (!booking) return undefined;
      const name = data.configurationName(booking.configurationId, booking.outputKind);
      const who = booking.detail ? ` · ${targetLabel(booking.detail)} · ${booking.detail.userName}` : '';
      return { label: `${name}${who}${booking.status === 'requested' ? ' (requested)' : ''}`, currentStart: booking.startsAt };
    },
    [bookings, data.configurationName],
  );

  if (user.role !== 'staff') {
    return (
      <section data-testid="not-available" className="max-w-xl py-10">
        <h1 className="text-2xl font-bold">Planning is for facility staff</h1>
        <p className="mt-3 text-ink-muted">Only facility scientists reorder a day's beam time.</p>
        <Link to={paths.calendar} className="mt-6 inline-block font-semibold text-accent hover:underline">
          Back to the calendar
        </Link>
      </section>
    );
  }
  if (data.facility.isPending || data.instruments.isPending) return <PageLoading label="Loading" />;
  if (data.facility.isError || data.instruments.isError) {
    return <Notice tone="danger" title="Could not load the facility">{(data.facility.error ?? data.instruments.error)?.message}</Notice>;
  }

  return (
    <>
      <PageHeader
        title="Plan the day"
        lead="Reorder the day's bookings within their flexibility so the source spends less time retuning. Nothing changes until you apply the plan."
        actions={
          <Link to={paths.calendar} className="rounded-lg px-3 py-2 text-sm font-semibold text-accent hover:bg-sunk">
            Back to the calendar
          </Link>
        }
      />
      <PlanDayPanel
        instruments={data.instrumentList}
        instrumentId={instrumentId}
        date={date}
        onInstrumentChange={setInstrumentId}
        onDateChange={setDate}
        timeZone={timeZone}
        describe={describe}
      />
    </>
  );
}
