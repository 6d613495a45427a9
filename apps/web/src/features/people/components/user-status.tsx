import type { User } from '@femtoslot/shared';
import { cx } from '../../../lib/cx';

export type UserStatus = 'active' | 'deactivated' | 'invitation_pending';

export const userStatusLabels: Record<UserStatus, string> = {
  active: 'Active',
  deactivated: 'Deactivated',
  invitation_pending: 'Invitation pending',
};

export function userStatus(user: Pick<User, 'active' | 'invitationPending'>): UserStatus {
  if (!user.active) return 'deactivated';
  if (user.invitationPending) return 'invitation_pending';
  return 'active';
}

const tones: Record<UserStatus, string> = {
  active: 'bg-success-soft text-success',
  deactivated: 'bg-sunk text-ink-muted',
  invitation_pending: 'bg-caution-bg text-caution-ink',
};

export function UserStatusBadge({ status }: { status: UserStatus }) {
  return (
    <span
      data-testid="user-status"
      data-status={status}
      className={cx('inline-flex rounded-full px-2 py-0.5 text-xs font-semibold whitespace-nowrap', tones[status])}
    >
      {userStatusLabels[status]}
    </span>
  );
}
