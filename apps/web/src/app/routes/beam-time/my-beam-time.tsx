import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading, Spinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useGroupSpend } from '../../../features/beam-time/api/get-group-spend';
import { useMyBeamTime } from '../../../features/beam-time/api/get-my-beam-time';
import { GroupSpendPanel } from '../../../features/beam-time/components/group-spend-panel';
import { MyBookingsTable } from '../../../features/beam-time/components/my-bookings-table';
import { BookingDetails } from '../../../features/bookings/components/booking-details';
import { defaultConfigurationName } from '../../../features/bookings/lib/calendar-events';
import { defaultCancellationWindows } from '../../../features/bookings/lib/cancellation-fee';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useSignedInUser } from '../../../lib/auth';
import { beamTimeKeys } from '../../../lib/query-keys';
import { viewerTimeZone } from '../../../lib/wall-time';
import { ZoneToggle } from '../calendar/calendar-parts';

/** Roles whose spend section the API answers without naming a group: a PI's group, a member's own bookings. */
const spendRoles = new Set(['pi', 'member', 'collaborator']);

export function MyBeamTimePage() {
  const user = useSignedInUser();
  const facility = useFacility();
  const mine = useMyBeamTime();
  const spend = useGroupSpend({}, spendRoles.has(user.role));
  const queryClient = useQueryClient();
  const [zoneMode, setZoneMode] = useState<'facility' | 'viewer'>('facility');
  const [search, setSearch] = useSearchParams();
  const openId = search.get('booking');
  const bookings = mine.data ?? [];
  const configurationName = useCallback(
    (configurationId: string, outputKind: string) => bookings.find((b) => b.configurationId === configurationId)?.configurationName || defaultConfigurationName(outputKind),
    [bookings],
  );

  if (facility.isPending || mine.isPending) return <PageLoading label="Loading your beam time" />;
  if (facility.isError || mine.isError) {
    return (
      <Notice tone="danger" title="Your beam time could not be loaded">
        {(facility.error ?? mine.error)?.message}
      </Notice>
    );
  }

  const facilityZone = facility.data.timeZone;
  const ownZone = viewerTimeZone();
  const shownZone = zoneMode === 'facility' ? facilityZone : ownZone;
  const otherZone = zoneMode === 'facility' ? ownZone : facilityZone;
  const open = bookings.find((b) => b.id === openId) ?? null;
  const closeDetails = () => {
    setSearch((s) => {
      s.delete('booking');
      return s;
    });
    // the dialog may have cancelled the booking
    void queryClient.invalidateQueries({ queryKey: beamTimeKeys.all });
  };

  return (
    <>
      <PageHeader
        title="My beam time"
        lead="Your upcoming requests and bookings with where each stands, and what your beam time has cost so far."
        actions={
          <Link to={paths.calendar} className="rounded-lg px-3 py-2 text-sm font-semibold text-accent hover:bg-sunk" data-testid="to-calendar">
            Request beam time on the calendar
          </Link>
        }
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_21rem]">
        <div className="min-w-0 space-y-6">
          <section className="space-y-3" aria-labelledby="upcoming-heading">
            <div className="flex flex-wrap items-end justify-between gap-3">
              <h2 id="upcoming-heading" className="text-lg font-bold">Upcoming</h2>
              <ZoneToggle mode={zoneMode} facilityZone={facilityZone} viewerZone={ownZone} onToggle={() => setZoneMode(zoneMode === 'facility' ? 'viewer' : 'facility')} />
            </div>
            <MyBookingsTable bookings={bookings} timeZone={shownZone} otherTimeZone={otherZone} detailsHref={(id) => `?booking=${encodeURIComponent(id)}`} />
          </section>
          {spendRoles.has(user.role) &&
            (spend.isPending ? (
              <p role="status" className="flex items-center gap-2 text-sm text-ink-muted"><Spinner /> Adding up the spend</p>
            ) : spend.isError ? (
              <Notice tone="danger" title="The spend could not be added up">{spend.error.message}</Notice>
            ) : (
              <GroupSpendPanel spend={spend.data} />
            ))}
        </div>
        <aside className="space-y-4">
          <LaserCaution />
        </aside>
      </div>
      <BookingDetails
        booking={open}
        onClose={closeDetails}
        timeZone={shownZone}
        facilityTimeZone={facilityZone}
        isStaff={user.role === 'staff'}
        viewerOrganisationId={user.organisation.id}
        windows={facility.data.policies ?? defaultCancellationWindows}
        configurationName={configurationName}
      />
    </>
  );
}
