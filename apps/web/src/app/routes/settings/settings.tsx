import { Link } from 'react-router-dom';
import { PageHeader } from '../../../components/ui/page-header';
import { paths } from '../../../config/paths';
import { FacilityPoliciesForm } from '../../../features/facility/components/facility-policies-form';
import { FeedUrlCard } from '../../../features/calendar-feed/components/feed-url-card';
import { EyewearEditor } from '../../../features/safety/components/eyewear-editor';
import { useSignedInUser } from '../../../lib/auth';

export function SettingsPage() {
  const user = useSignedInUser();
  return (
    <>
      <PageHeader
        title="Settings"
        lead={
          <>
            How the facility runs: booking policies, laser-safety eyewear and your calendar feed. The OD each configuration needs per wavelength band is recorded
            with the configuration under{' '}
            <Link className="font-semibold underline" to={paths.sources}>
              Sources &amp; stations
            </Link>
            .
          </>
        }
      />
      <div className="grid max-w-5xl gap-6">
        <FacilityPoliciesForm canEdit={user.role === 'admin'} />
        <EyewearEditor />
        <div className="max-w-xl">
          <FeedUrlCard />
        </div>
      </div>
    </>
  );
}
