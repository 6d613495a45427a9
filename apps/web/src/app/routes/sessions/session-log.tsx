import { Link, useParams } from 'react-router-dom';
import { ConfigurationChip } from '../../../components/ui/configuration-chip';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useConfigurations } from '../../../features/configurations/api/get-configurations';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useUsage } from '../../../features/usage-logs/api/get-usage';
import { UsageForm } from '../../../features/usage-logs/components/usage-form';
import { isApiError } from '../../../lib/api-client';
import { useSignedInUser } from '../../../lib/auth';
import { formatInstant } from '../../../lib/wall-time';

export function SessionLogPage() {
  const { bookingId = '' } = useParams();
  const user = useSignedInUser();
  const facility = useFacility();
  const usage = useUsage(bookingId);
  const instrumentId = usage.data?.booking.instrumentId;
  const configurations = useConfigurations(instrumentId);

  const back = (
    <Link to={paths.sessions} className="rounded-lg px-3 py-2 text-sm font-semibold text-accent hover:bg-sunk">
      ← All sessions
    </Link>
  );
  if (facility.isPending || usage.isPending || (instrumentId && configurations.isPending)) return <PageLoading label="Loading the session" />;
  if (facility.isError || usage.isError || configurations.isError) {
    const error = facility.error ?? usage.error ?? configurations.error;
    return (
      <>
        <PageHeader title="Session log" actions={back} />
        <Notice tone="danger" title={isApiError(error) && error.status === 403 ? 'This session belongs to another organisation' : 'The session could not be loaded'}>
          {error?.message}
        </Notice>
      </>
    );
  }

  const { booking, log, graceMinutes, window: usageWindow } = usage.data;
  const timeZone = facility.data.timeZone;
  const instrumentConfigurations = (configurations.data ?? []).filter((c) => c.instrumentId === booking.instrumentId);
  const booked = instrumentConfigurations.find((c) => c.id === booking.configurationId);

  return (
    <>
      <PageHeader
        title="Session log"
        lead={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <ConfigurationChip name={booked?.name ?? booking.configurationKey} outputKind={booking.outputKind} />
            <span>Booked {formatInstant(booking.startsAt, timeZone)}</span>
            {booking.detail && (
              <span className="whitespace-nowrap">
                {booking.detail.userName}, {booking.detail.organisationName}
              </span>
            )}
          </span>
        }
        actions={back}
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0">
          <UsageForm
            key={booking.id}
            booking={booking}
            log={log}
            graceMinutes={graceMinutes}
            usageWindow={usageWindow}
            configurations={instrumentConfigurations}
            timeZone={timeZone}
            canConfirm={user.role === 'staff'}
          />
        </div>
        <aside className="space-y-4">
          <LaserCaution />
        </aside>
      </div>
    </>
  );
}
