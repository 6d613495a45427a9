import type { BookingDto, MaintenanceDto } from '@femtoslot/shared';
import { useEffect, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { ConfigurationLegend } from '../../../components/ui/configuration-legend';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useAccounts } from '../../../features/accounts/api/get-accounts';
import { useCalendar } from '../../../features/bookings/api/get-calendar';
import { BeamTimeCalendar, type MaintenanceChange } from '../../../features/bookings/components/beam-time-calendar';
import { BookingDetails } from '../../../features/bookings/components/booking-details';
import { CalendarKey } from '../../../features/bookings/components/calendar-key';
import { NeedsRebookingPanel } from '../../../features/bookings/components/needs-rebooking-panel';
import { PendingRequests } from '../../../features/bookings/components/pending-requests';
import { cancellationPolicyText, defaultCancellationWindows } from '../../../features/bookings/lib/cancellation-fee';
import { weekShownAt } from '../../../features/bookings/lib/calendar-week';
import { FeedUrlCard } from '../../../features/calendar-feed/components/feed-url-card';
import { useUpdateMaintenance } from '../../../features/maintenance/api/update-maintenance';
import { displacedToast } from '../../../features/maintenance/components/displaced-toast';
import { useSignedInUser } from '../../../lib/auth';
import { viewerTimeZone } from '../../../lib/wall-time';
import { MaintenanceFormDialog, RequestFormDialog, preloadCalendarForms, preloadCalendarFormsWhenIdle } from './calendar-forms';
import { NotOnGrid, SelectionChoice, ZoneToggle } from './calendar-parts';
import { useBeamTimeData } from './use-beam-time-data';

type Slot = { startsAt: string; endsAt: string };

// a pointer on a button or the grid usually means a form is next: start fetching it before the click lands
const formIntent = { onPointerEnter: preloadCalendarForms, onFocus: preloadCalendarForms };

export function CalendarPage() {
  const user = useSignedInUser();
  const isStaff = user.role === 'staff';
  const data = useBeamTimeData();
  const accounts = useAccounts();
  const [pickedInstrumentId, setInstrumentId] = useState<string | null>(null);
  const [zoneMode, setZoneMode] = useState<'facility' | 'viewer'>('facility');
  const [range, setRange] = useState<{ from: string; to: string } | null>(null);
  const [selection, setSelection] = useState<Slot | null>(null);
  const [request, setRequest] = useState<Partial<Slot> | null>(null);
  const [maintenance, setMaintenance] = useState<{ initial: Partial<Slot>; existing: MaintenanceDto | null } | null>(null);
  const [details, setDetails] = useState<BookingDto | null>(null);
  const updateMaintenance = useUpdateMaintenance();

  const instrumentId = pickedInstrumentId ?? data.defaultInstrumentId;
  const facilityZoneKnown = data.facility.data?.timeZone;
  // until the grid reports its range, the week it is about to show (the one the route loader asked for)
  const openingWeek = useMemo(() => (facilityZoneKnown ? weekShownAt(new Date(), facilityZoneKnown) : null), [facilityZoneKnown]);
  const shownRange = range ?? openingWeek;
  const calendar = useCalendar(shownRange && instrumentId ? { ...shownRange, instrumentId } : null);
  const weekShown = calendar.data !== undefined;
  useEffect(() => (weekShown ? preloadCalendarFormsWhenIdle() : undefined), [weekShown]);

  if (data.facility.isPending || data.instruments.isPending) return <PageLoading label="Loading the calendar" />;
  if (data.facility.isError || data.instruments.isError) {
    return (
      <Notice tone="danger" title="The calendar could not be loaded">
        {(data.facility.error ?? data.instruments.error)?.message}
      </Notice>
    );
  }

  const facilityZone = data.facility.data.timeZone;
  const ownZone = viewerTimeZone();
  const shownZone = zoneMode === 'facility' ? facilityZone : ownZone;
  const policies = data.facility.data.policies;
  const windows = policies ?? defaultCancellationWindows;

  const openFromSelection = (slot: Slot) => (isStaff ? setSelection(slot) : setRequest(slot));
  const onMaintenanceChange = ({ maintenance: m, startsAt, endsAt, revert }: MaintenanceChange) =>
    updateMaintenance.mutate(
      { id: m.id, startsAt, endsAt },
      {
        onSuccess: (result) => displacedToast('moved', result),
        onError: (error) => {
          revert();
          toast.error(error.message);
        },
      },
    );

  return (
    <>
      <PageHeader
        title="Calendar"
        lead="Beam time on the source and the benches, by configuration, with the changeover each booking needs."
        actions={
          <>
            {isStaff && (
              <Link to={paths.planDay} data-testid="plan-day-link" className="rounded-lg px-3 py-2 text-sm font-semibold text-accent hover:bg-sunk">
                Plan the day
              </Link>
            )}
            {isStaff && (
              <Button variant="secondary" data-testid="new-maintenance-button" {...formIntent} onClick={() => setMaintenance({ initial: {}, existing: null })}>
                Block maintenance
              </Button>
            )}
            <Button data-testid="new-request-button" {...formIntent} onClick={() => setRequest({})}>
              Request beam time
            </Button>
          </>
        }
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_21rem]">
        <div className="min-w-0 space-y-4">
          <div className="flex flex-wrap items-end gap-3">
            <label className="text-sm">
              <span className="mb-1 block font-semibold">Instrument</span>
              <select
                data-testid="instrument-filter"
                value={instrumentId}
                onChange={(e) => setInstrumentId(e.target.value)}
                className="rounded-lg border border-line bg-panel px-3 py-2 text-sm"
              >
                {data.instrumentList.map((i) => (
                  <option key={i.id} value={i.id}>
                    {i.name}
                  </option>
                ))}
              </select>
            </label>
            <ZoneToggle mode={zoneMode} facilityZone={facilityZone} viewerZone={ownZone} onToggle={() => setZoneMode(zoneMode === 'facility' ? 'viewer' : 'facility')} />
            {calendar.isFetching && <span className="pb-2 text-xs text-ink-muted">Refreshing…</span>}
          </div>
          {calendar.isError && <Notice tone="danger" title="Bookings could not be loaded">{calendar.error.message}</Notice>}
          <div onPointerDownCapture={preloadCalendarForms}>
            <BeamTimeCalendar
              timeZone={shownZone}
              // drawn once the configuration names are in (they are asked for alongside the week and come back
              // sooner): drawing with stand-in names first would redraw every event a moment later
              calendar={data.configurationsLoading ? undefined : calendar.data}
              configurationName={data.configurationName}
              canEditMaintenance={isStaff}
              stationName={data.instrumentName}
              onRangeChange={setRange}
              onSelectRange={openFromSelection}
              onBookingClick={setDetails}
              onMaintenanceClick={(m) => (isStaff ? setMaintenance({ initial: {}, existing: m }) : toast.info(`Maintenance: ${m.reason}`))}
              onMaintenanceChange={onMaintenanceChange}
            />
          </div>
          <NotOnGrid bookings={calendar.data?.bookings ?? []} timeZone={shownZone} configurationName={data.configurationName} onOpen={setDetails} />
        </div>
        <aside className="space-y-4">
          <LaserCaution />
          <NeedsRebookingPanel timeZone={shownZone} isStaff={isStaff} configurationName={data.configurationName} />
          {isStaff && <PendingRequests timeZone={shownZone} configurationName={data.configurationName} onOpen={setDetails} />}
          <ConfigurationLegend />
          <CalendarKey />
          <FeedUrlCard />
        </aside>
      </div>

      <SelectionChoice
        slot={selection}
        timeZone={shownZone}
        onClose={() => setSelection(null)}
        onRequest={(slot) => (setSelection(null), setRequest(slot))}
        onMaintenance={(slot) => (setSelection(null), setMaintenance({ initial: slot, existing: null }))}
      />
      {request && (
        <RequestFormDialog
          open
          onClose={() => setRequest(null)}
          timeZone={facilityZone}
          instruments={data.instrumentList}
          configurations={data.configurations}
          accounts={accounts.data ?? []}
          initial={{ instrumentId, ...request }}
          policyText={cancellationPolicyText(windows)}
          limits={policies}
        />
      )}
      {maintenance && (
        <MaintenanceFormDialog
          open
          onClose={() => setMaintenance(null)}
          timeZone={facilityZone}
          instruments={data.instrumentList}
          initial={{ instrumentId, ...maintenance.initial }}
          existing={maintenance.existing}
        />
      )}
      <BookingDetails
        booking={details}
        onClose={() => setDetails(null)}
        timeZone={shownZone}
        facilityTimeZone={facilityZone}
        isStaff={isStaff}
        viewerOrganisationId={user.organisation.id}
        windows={windows}
        configurationName={data.configurationName}
        instrumentName={data.instrumentName}
      />
    </>
  );
}
