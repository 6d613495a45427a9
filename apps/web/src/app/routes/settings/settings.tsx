import { PageHeader } from '../../../components/ui/page-header';
import { FeedUrlCard } from '../../../features/calendar-feed/components/feed-url-card';
import { RequiredOdTable } from '../../../features/configurations/components/required-od-table';
import { EyewearEditor } from '../../../features/safety/components/eyewear-editor';
import { useBeamTimeData } from '../calendar/use-beam-time-data';

export function SettingsPage() {
  const data = useBeamTimeData();
  return (
    <>
      <PageHeader title="Settings" lead="How the facility runs: laser-safety eyewear, the OD each configuration needs, and your calendar feed." />
      <div className="grid max-w-5xl gap-6">
        <EyewearEditor />
        <RequiredOdTable
          instruments={data.instrumentList}
          configurations={data.configurations}
          loading={data.instruments.isPending || data.configurationsLoading}
          error={data.instruments.error?.message ?? data.configurationsError}
        />
        <div className="max-w-xl">
          <FeedUrlCard />
        </div>
      </div>
    </>
  );
}
