import { ComingSoon } from '../../../components/ui/coming-soon';
import { PageHeader } from '../../../components/ui/page-header';

export function SettingsPage() {
  return (
    <>
      <PageHeader title="Settings" lead="How the facility runs: instruments, configurations and rules." />
      <div className="max-w-3xl">
        <ComingSoon>
          <p>
            Settings for instruments and configurations, the changeover model, booking rules, rate cards and
            organisations are being built.
          </p>
        </ComingSoon>
      </div>
    </>
  );
}
