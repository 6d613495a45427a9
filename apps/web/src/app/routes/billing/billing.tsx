import { ComingSoon } from '../../../components/ui/coming-soon';
import { PageHeader } from '../../../components/ui/page-header';

export function BillingPage() {
  return (
    <>
      <PageHeader title="Billing" lead="Invoices and cost-centre journals for beam time." />
      <div className="max-w-3xl">
        <ComingSoon>
          <p>
            Billing periods, invoices for external accounts and journals for internal cost centres, all built from
            confirmed session logs, are being built.
          </p>
          <p>Nothing is charged through Femtoslot yet.</p>
        </ComingSoon>
      </div>
    </>
  );
}
