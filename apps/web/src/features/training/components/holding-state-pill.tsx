import type { HoldingState } from '@femtoslot/shared';
import { Button } from '../../../components/ui/button';
import { type PillTone, StatusPill } from '../../../components/ui/status-pill';

const look: Record<HoldingState, { tone: PillTone; label: string }> = {
  valid: { tone: 'success', label: 'Valid' },
  expired: { tone: 'caution', label: 'Expired' },
  revoked: { tone: 'danger', label: 'Revoked' },
  not_yet_valid: { tone: 'accent', label: 'Not yet in force' },
};

export function HoldingStatePill({ state }: { state: HoldingState }) {
  return <StatusPill tone={look[state].tone}>{look[state].label}</StatusPill>;
}

/** A training record's or sign-off's state cell: the pill, and for a revoked one the reason and who revoked it. */
export function HoldingStateCell({ holding }: { holding: { state: HoldingState; revokedReason: string | null; revokedByName: string | null } }) {
  return (
    <td className="px-4 py-2">
      <HoldingStatePill state={holding.state} />
      {holding.revokedReason && <p className="mt-1 text-xs text-ink-muted">{holding.revokedReason} — {holding.revokedByName}</p>}
    </td>
  );
}

/** The officer's revoke column of a holdings table: a header, then a button on each row not already revoked. */
export function RevokeHeader() {
  return <th className="px-4 py-2"><span className="sr-only">Actions</span></th>;
}

export function RevokeCell({ state, onRevoke }: { state: HoldingState; onRevoke: () => void }) {
  return (
    <td className="px-4 py-2 text-right">
      {state !== 'revoked' && <Button size="sm" variant="danger" onClick={onRevoke}>Revoke</Button>}
    </td>
  );
}
