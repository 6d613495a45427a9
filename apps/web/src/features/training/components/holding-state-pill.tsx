import type { HoldingState } from '@femtoslot/shared';
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
