import type { Role } from '@femtoslot/shared';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { BillingPeriodsPanel } from '../../../features/billing/components/billing-periods-panel';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useSignedInUser } from '../../../lib/auth';
import { AccountsSection, InvoicesSection, PeriodInvoices, RateCardsSection, Section } from './billing-sections';

/** Which parts of the billing page a role gets, following what the billing API lets each role do. */
export function billingViewFor(role: Role) {
  const facilityWide = role === 'finance' || role === 'admin';
  return {
    periods: facilityWide,
    closePeriods: role === 'finance',
    journalExport: facilityWide,
    rateCards: facilityWide,
    editRateCards: role === 'finance',
    approveAccounts: role === 'pi',
    requestAccounts: role === 'pi' || role === 'collaborator' || role === 'finance',
  };
}

const jumpLink = 'rounded-full border border-line bg-panel px-3 py-1 text-xs font-semibold text-ink-muted hover:text-ink';

export function BillingPage() {
  const user = useSignedInUser();
  const facility = useFacility();
  const view = billingViewFor(user.role);
  const formKind = view.requestAccounts ? (user.organisation.kind === 'internal' ? 'cost_centre' : 'external') : null;

  return (
    <div data-testid="billing-page">
      <PageHeader
        title="Billing"
        lead="Beam time is billed from confirmed session logs: external accounts by invoice, internal groups by cost-centre journal."
      />
      <nav aria-label="On this page" className="mb-6 flex flex-wrap gap-2">
        {view.periods && <a href="#periods" className={jumpLink}>Billing periods</a>}
        <a href="#invoices" className={jumpLink}>Invoices</a>
        {view.rateCards && <a href="#rate-cards" className={jumpLink}>Rate cards</a>}
        <a href="#accounts" className={jumpLink}>Accounts</a>
      </nav>
      {facility.isPending ? (
        <PageLoading label="Loading the facility" />
      ) : facility.isError ? (
        <Notice tone="danger" title="The facility could not be loaded">{facility.error.message}</Notice>
      ) : (
        <div className="space-y-10">
          {view.periods && (
            <Section
              id="periods"
              title={view.closePeriods ? 'Close a billing period' : 'Billing periods'}
              lead={`Amounts in ${facility.data.currency}; months are calendar months in ${facility.data.timeZone}.`}
            >
              <BillingPeriodsPanel
                timeZone={facility.data.timeZone}
                canClose={view.closePeriods}
                closedInvoices={(periodId) => <PeriodInvoices periodId={periodId} />}
              />
            </Section>
          )}
          <InvoicesSection journal={view.journalExport} />
          {view.rateCards && <RateCardsSection currency={facility.data.currency} timeZone={facility.data.timeZone} canEdit={view.editRateCards} />}
          <AccountsSection canApprove={view.approveAccounts} formKind={formKind} />
        </div>
      )}
    </div>
  );
}
