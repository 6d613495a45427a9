import type { PriceLine } from '@femtoslot/shared';
import { formatDuration } from '@femtoslot/shared/billing/pricing';
import { StatusPill } from '../../../components/ui/status-pill';
import { formatMinor, formatRatePerHour } from '../../../lib/money';
import type { AccountStatement, PeriodPreview as Preview } from '../types';

const lineKindLabels: Record<PriceLine['kind'], string> = {
  usage: 'Beam time',
  changeover: 'Changeover',
  cancellation_fee: 'Cancellation fee',
  displacement: 'Displaced by maintenance',
};

function AccountReference({ account }: { account: AccountStatement }) {
  if (account.accountKind === 'cost_centre') {
    return (
      <span className="flex flex-wrap items-center gap-1.5">
        <StatusPill tone="neutral">Internal · journal</StatusPill>
        <span className="font-mono text-xs">{account.costCentreCode ?? 'no cost centre'}</span>
      </span>
    );
  }
  return (
    <span className="flex flex-wrap items-center gap-1.5">
      <StatusPill tone="accent">External · invoice</StatusPill>
      {account.poNumber && <span className="text-xs">PO {account.poNumber}</span>}
    </span>
  );
}

function AccountBlock({ account, currency }: { account: AccountStatement; currency: string }) {
  return (
    <section data-testid="preview-account" data-account-id={account.accountId} className="overflow-hidden rounded-xl border border-line bg-panel">
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-line bg-sunk/60 px-4 py-3">
        <div>
          <h4 className="font-semibold">{account.accountName}</h4>
          <p className="text-xs text-ink-muted">{account.organisationName}</p>
        </div>
        <AccountReference account={account} />
      </header>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">Lines charged to {account.accountName}</caption>
          <thead className="text-xs text-ink-muted">
            <tr>
              <th scope="col" className="px-4 py-2 font-semibold">Line</th>
              <th scope="col" className="px-4 py-2 text-right font-semibold">Time</th>
              <th scope="col" className="px-4 py-2 text-right font-semibold">Rate</th>
              <th scope="col" className="px-4 py-2 text-right font-semibold">Amount</th>
            </tr>
          </thead>
          <tbody>
            {account.lines.map((line) => (
              <tr key={line.key} data-testid="preview-line" data-kind={line.kind} data-amount-minor={line.amountMinor} className="border-t border-line align-top">
                <td className="px-4 py-2">
                  <span className="block text-xs font-semibold uppercase tracking-wide text-ink-muted">{lineKindLabels[line.kind]}</span>
                  <span className="block">{line.label}</span>
                  <span className="block text-xs text-ink-muted">{line.explanation}</span>
                </td>
                <td className="whitespace-nowrap px-4 py-2 text-right tabular-nums">{formatDuration(line.minutes)}</td>
                <td className="whitespace-nowrap px-4 py-2 text-right tabular-nums">{formatRatePerHour(line.rateMinorPerHour, currency)}</td>
                <td className="whitespace-nowrap px-4 py-2 text-right font-semibold tabular-nums">{formatMinor(line.amountMinor, currency)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="border-t-2 border-line">
              <th scope="row" colSpan={3} className="px-4 py-2 text-right font-semibold">
                Total for {account.accountName}
              </th>
              <td data-testid="preview-account-total" data-amount-minor={account.totalMinor} className="whitespace-nowrap px-4 py-2 text-right font-bold tabular-nums">
                {formatMinor(account.totalMinor, currency)}
              </td>
            </tr>
          </tfoot>
        </table>
      </div>
    </section>
  );
}

/** What closing the period would charge: every account, every line with why, and the totals. */
export function PeriodPreview({ preview }: { preview: Preview }) {
  const { currency } = preview;
  const journals = preview.accounts.filter((a) => a.accountKind === 'cost_centre').length;
  return (
    <div data-testid="period-preview" className="space-y-4">
      {preview.accounts.length === 0 ? (
        <p className="rounded-xl border border-dashed border-line px-4 py-8 text-center text-sm text-ink-muted">
          Nothing to bill in this month: no confirmed, unbilled session logs, cancellation fees or displaced bookings.
        </p>
      ) : (
        preview.accounts.map((account) => <AccountBlock key={account.accountId} account={account} currency={currency} />)
      )}
      <div className="flex flex-wrap items-baseline justify-between gap-3 rounded-xl border border-accent/40 bg-accent-soft px-4 py-3">
        <p className="text-sm">
          {preview.accounts.length - journals} external invoice{preview.accounts.length - journals === 1 ? '' : 's'} and {journals} cost-centre journal
          {journals === 1 ? '' : 's'}
        </p>
        <p className="text-sm">
          Period total{' '}
          <span data-testid="preview-total" data-amount-minor={preview.totalMinor} className="ml-2 text-lg font-bold tabular-nums">
            {formatMinor(preview.totalMinor, currency)}
          </span>
        </p>
      </div>
    </div>
  );
}
