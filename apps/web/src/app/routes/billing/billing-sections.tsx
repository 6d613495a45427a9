import { localDate } from '@femtoslot/shared/time/zoned-time';
import { type ReactNode, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { PageLoading } from '../../../components/ui/spinner';
import { AccountForm } from '../../../features/accounts/components/account-form';
import { AccountsTable } from '../../../features/accounts/components/accounts-table';
import { useAccounts } from '../../../features/accounts/api/get-accounts';
import { useInvoices } from '../../../features/invoices/api/get-invoices';
import { ExportLinks } from '../../../features/invoices/components/export-links';
import { InvoicesTable } from '../../../features/invoices/components/invoices-table';
import { useRateCards } from '../../../features/rates/api/get-rate-cards';
import { RateCardForm } from '../../../features/rates/components/rate-card-form';
import { RateCardsList } from '../../../features/rates/components/rate-cards-list';

export function Section({ id, title, lead, actions, children, testId }: { id: string; title: string; lead?: ReactNode; actions?: ReactNode; children: ReactNode; testId?: string }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} data-testid={testId} className="scroll-mt-6 space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3 border-b border-line pb-2">
        <div>
          <h2 id={`${id}-title`} className="text-lg font-bold tracking-tight">{title}</h2>
          {lead && <p className="max-w-prose text-sm text-ink-muted">{lead}</p>}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}

/** Every invoice the viewer may see, with the CSV exports. */
export function InvoicesSection({ journal }: { journal: boolean }) {
  const invoices = useInvoices();
  return (
    <Section
      id="invoices"
      title="Invoices and journals"
      lead="External accounts are invoiced through Stripe; internal cost centres are charged by journal. Pay online opens the payment page; this list refreshes when you come back."
      actions={<ExportLinks journal={journal} />}
    >
      {invoices.isPending ? (
        <PageLoading label="Loading invoices" />
      ) : invoices.isError ? (
        <Notice tone="danger" title="Invoices could not be loaded">{invoices.error.message}</Notice>
      ) : (
        <InvoicesTable invoices={invoices.data} empty="No invoices yet: they appear when finance closes a billing period." />
      )}
    </Section>
  );
}

export function PeriodInvoices({ periodId }: { periodId: string }) {
  const invoices = useInvoices();
  if (invoices.isPending) return <PageLoading label="Loading invoices" />;
  if (invoices.isError) return <Notice tone="danger" title="Invoices could not be loaded">{invoices.error.message}</Notice>;
  return <InvoicesTable variant="period" invoices={invoices.data.filter((i) => i.periodId === periodId)} empty="This period issued no invoices or journals." />;
}

function firstOfNextMonth(today: string): string {
  const [y, m] = today.split('-').map(Number) as [number, number];
  return m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, '0')}-01`;
}

export function RateCardsSection({ currency, timeZone, canEdit }: { currency: string; timeZone: string; canEdit: boolean }) {
  const cards = useRateCards();
  const [adding, setAdding] = useState(false);
  const today = localDate(new Date(), timeZone);
  return (
    <Section
      id="rate-cards"
      testId="rate-cards"
      title="Rate cards"
      lead="Price per hour by user category and configuration rate class, each card in force from its date. Time is rounded up to the billing increment."
      actions={canEdit && !adding ? <Button variant="secondary" data-testid="add-rate-card" onClick={() => setAdding(true)}>Add a rate card</Button> : undefined}
    >
      {canEdit && adding && cards.data && (
        <RateCardForm currency={currency} latest={cards.data.rateCards[0]} defaultEffectiveFrom={firstOfNextMonth(today)} onDone={() => setAdding(false)} />
      )}
      {cards.isPending ? (
        <PageLoading label="Loading rate cards" />
      ) : cards.isError ? (
        <Notice tone="danger" title="Rate cards could not be loaded">{cards.error.message}</Notice>
      ) : (
        <>
          {cards.data.cancellationPolicy && (
            <p data-testid="cancellation-policy" className="text-sm text-ink-muted">
              <span className="font-semibold text-ink">Cancellation fees:</span> {cards.data.cancellationPolicy.description}
            </p>
          )}
          <RateCardsList cards={cards.data.rateCards} today={today} />
        </>
      )}
    </Section>
  );
}

export function AccountsSection({ canApprove, formKind }: { canApprove: boolean; formKind: 'cost_centre' | 'external' | null }) {
  const accounts = useAccounts();
  return (
    <Section
      id="accounts"
      title="Accounts"
      lead={`Your organisation's accounts. A booking is charged to an approved account; ${canApprove ? 'as a PI you approve new ones' : 'a PI of your group approves new ones'}.`}
    >
      {accounts.isPending ? (
        <PageLoading label="Loading accounts" />
      ) : accounts.isError ? (
        <Notice tone="danger" title="Accounts could not be loaded">{accounts.error.message}</Notice>
      ) : (
        <AccountsTable accounts={accounts.data} canApprove={canApprove} />
      )}
      {formKind && <AccountForm kind={formKind} />}
    </Section>
  );
}
