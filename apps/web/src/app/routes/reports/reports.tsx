import { ComingSoon } from '../../../components/ui/coming-soon';
import { PageHeader } from '../../../components/ui/page-header';

export function ReportsPage() {
  return (
    <>
      <PageHeader title="Reports" lead="Use of the source and spend, over time." />
      <div className="max-w-3xl">
        <ComingSoon>
          <p>
            Reports on beam time used, changeover time and spend by group, account and configuration are being built.
          </p>
        </ComingSoon>
      </div>
    </>
  );
}
