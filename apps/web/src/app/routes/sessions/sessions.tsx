import { ComingSoon } from '../../../components/ui/coming-soon';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { PageHeader } from '../../../components/ui/page-header';

export function SessionsPage() {
  return (
    <>
      <PageHeader title="Session log" lead="What was actually tuned and measured in each booking." />
      <div className="max-w-3xl space-y-5">
        <ComingSoon>
          <p>
            Session logs are being built: actual start and end, the configurations used, the tuning range covered,
            average power and measured pulse duration.
          </p>
          <p>Staff will confirm each log before it is billed.</p>
        </ComingSoon>
        <LaserCaution />
      </div>
    </>
  );
}
