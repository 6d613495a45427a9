import type { GroupSpendDto } from '@femtoslot/shared/billing/spend.schemas';
import { TableShell } from '../../../components/ui/table-shell';

function Figure({ label, value, testId, strong = false }: { label: string; value: string; testId: string; strong?: boolean }) {
  return (
    <div className="rounded-xl border border-line bg-panel px-4 py-3">
      <div className="text-xs uppercase tracking-wide text-ink-muted">{label}</div>
      <div className={strong ? 'text-2xl font-bold tabular-nums' : 'text-xl font-semibold tabular-nums'} data-testid={testId}>{value}</div>
    </div>
  );
}

/** Spend to date: issued invoices and journals plus confirmed sessions and fees the next close will bill. */
export function GroupSpendPanel({ spend }: { spend: GroupSpendDto }) {
  const group = spend.scope === 'organisation';
  return (
    <section className="space-y-3" data-testid="group-spend" data-scope={spend.scope} aria-labelledby="spend-heading">
      <div>
        <h2 id="spend-heading" className="text-lg font-bold">{group ? `${spend.organisation.name}: spend to date` : 'Your spend to date'}</h2>
        <p className="text-sm text-ink-muted">
          {group ? 'Every account of your group.' : 'Your own bookings only; your PI sees the whole group.'} Billed is what invoices and cost-centre
          journals already carry; not yet billed is confirmed session time and cancellation fees, priced with the rate card the next
          billing close will use. Amounts in {spend.currency}.
        </p>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <Figure label="Billed" value={spend.billedFormatted} testId="spend-billed" />
        <Figure label="Not yet billed" value={spend.unbilledFormatted} testId="spend-unbilled" />
        <Figure label="Total" value={spend.totalFormatted} testId="spend-total" strong />
      </div>
      {group && spend.accounts.length > 0 && (
        <TableShell caption="Spend by account" testId="spend-accounts">
          <thead className="border-b border-line bg-sunk text-xs uppercase tracking-wide text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-semibold">Account</th>
              <th className="px-4 py-2 text-right font-semibold">Billed</th>
              <th className="px-4 py-2 text-right font-semibold">Not yet billed</th>
              <th className="px-4 py-2 text-right font-semibold">Total</th>
            </tr>
          </thead>
          <tbody>
            {spend.accounts.map((a) => (
              <tr key={a.accountId} data-testid="spend-account-row" className="border-b border-line last:border-0">
                <td className="px-4 py-2 font-medium">{a.accountName}</td>
                <td className="px-4 py-2 text-right tabular-nums">{a.billedFormatted}</td>
                <td className="px-4 py-2 text-right tabular-nums">{a.unbilledFormatted}</td>
                <td className="px-4 py-2 text-right font-semibold tabular-nums">{a.totalFormatted}</td>
              </tr>
            ))}
          </tbody>
        </TableShell>
      )}
      {spend.unbilledLines.length > 0 && (
        <details className="rounded-xl border border-line bg-panel px-4 py-3 text-sm">
          <summary className="cursor-pointer font-semibold">Not yet billed, line by line ({spend.unbilledLines.length})</summary>
          <ul className="mt-2 space-y-1.5">
            {spend.unbilledLines.map((l) => (
              <li key={l.key} className="flex justify-between gap-4" data-testid="spend-unbilled-line">
                <span>
                  {l.label}
                  <span className="block text-xs text-ink-muted">{l.explanation}{group ? ` · ${l.accountName}` : ''}</span>
                </span>
                <span className="tabular-nums">{l.amountFormatted}</span>
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}
