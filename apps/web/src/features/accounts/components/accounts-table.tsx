import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { type PillTone, StatusPill } from '../../../components/ui/status-pill';
import { TableShell } from '../../../components/ui/table-shell';
import { useApproveAccount } from '../api/approve-account';
import type { Account } from '../api/get-accounts';

const statusLabels: Record<string, string> = { pending: 'Waiting for approval', approved: 'Approved', inactive: 'Inactive' };
const statusTones: Record<string, PillTone> = { pending: 'caution', approved: 'success', inactive: 'neutral' };

function Reference({ account }: { account: Account }) {
  if (account.kind === 'cost_centre') return <span className="font-mono text-xs">{account.costCentreCode ?? '—'}</span>;
  return (
    <span className="text-sm">
      {account.poNumber ? `PO ${account.poNumber}` : 'No PO'}
      {account.poExpiresOn && <span className="block text-xs text-ink-muted">expires {account.poExpiresOn}</span>}
    </span>
  );
}

function ApproveButton({ account }: { account: Account }) {
  const approve = useApproveAccount();
  return (
    <Button
      size="sm"
      data-testid="approve-account"
      busy={approve.isPending}
      onClick={() =>
        approve.mutate(account.id, {
          onSuccess: () => toast.success(`${account.name} approved`),
          onError: (error) => toast.error(error.message),
        })
      }
    >
      Approve
    </Button>
  );
}

/** The organisation's accounts; a PI approves the pending ones. */
export function AccountsTable({ accounts, canApprove }: { accounts: Account[]; canApprove: boolean }) {
  return (
    <TableShell caption="Accounts" testId="accounts-table" isEmpty={accounts.length === 0} empty="No accounts yet. Add one below to charge beam time to it.">
      <thead className="border-b border-line bg-sunk/60 text-xs text-ink-muted">
        <tr>
          <th scope="col" className="px-4 py-2 font-semibold">Account</th>
          <th scope="col" className="px-4 py-2 font-semibold">Cost centre or PO</th>
          <th scope="col" className="px-4 py-2 font-semibold">Status</th>
          <th scope="col" className="px-4 py-2 font-semibold">Usable for bookings</th>
          {canApprove && <th scope="col" className="px-4 py-2"><span className="sr-only">Approve</span></th>}
        </tr>
      </thead>
      <tbody>
        {accounts.map((account) => (
          <tr key={account.id} data-testid="account-row" data-account-id={account.id} data-status={account.status} data-usable={account.usable} className="border-t border-line align-top">
            <td className="px-4 py-2.5">
              <span className="font-semibold">{account.name}</span>
              <span className="block text-xs text-ink-muted">{account.kind === 'cost_centre' ? 'Internal cost centre' : 'External, invoiced'}</span>
            </td>
            <td className="px-4 py-2.5"><Reference account={account} /></td>
            <td className="px-4 py-2.5">
              <StatusPill tone={statusTones[account.status] ?? 'neutral'}>{statusLabels[account.status] ?? account.status}</StatusPill>
            </td>
            <td className="px-4 py-2.5 text-sm">
              {account.usable ? <span className="font-semibold text-success">Yes</span> : <span className="text-ink-muted">No: {account.reason ?? 'not usable'}</span>}
            </td>
            {canApprove && <td className="px-4 py-2.5 text-right">{account.status === 'pending' && <ApproveButton account={account} />}</td>}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
