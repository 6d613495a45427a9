import { type Role, type User, roles } from '@femtoslot/shared';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { roleLabels } from '../../../config/roles';
import { useUpdateUser } from '../api/update-user';

export function RoleSelect({ user, disabled }: { user: User; disabled?: boolean }) {
  const update = useUpdateUser();
  return (
    <select
      aria-label={`Role for ${user.name}`}
      data-testid="user-role-select"
      value={user.role}
      disabled={disabled || update.isPending}
      onChange={(event) => {
        const role = event.target.value as Role;
        update.mutate(
          { id: user.id, changes: { role } },
          {
            onSuccess: ({ user: saved }) => toast.success(`${saved.name} is now ${roleLabels[saved.role]}`),
            onError: (error) => toast.error(error.message),
          },
        );
      }}
      className="rounded-md border border-line bg-panel px-2 py-1 text-sm disabled:opacity-60"
    >
      {roles.map((role) => (
        <option key={role} value={role}>
          {roleLabels[role]}
        </option>
      ))}
    </select>
  );
}

export function ActiveToggle({ user, disabled }: { user: User; disabled?: boolean }) {
  const update = useUpdateUser();
  const next = !user.active;
  return (
    <Button
      size="sm"
      variant={user.active ? 'danger' : 'secondary'}
      data-testid="user-active-toggle"
      busy={update.isPending}
      disabled={disabled}
      aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
      onClick={() =>
        update.mutate(
          { id: user.id, changes: { active: next } },
          {
            onSuccess: ({ user: saved }) =>
              toast.success(saved.active ? `${saved.name} can sign in again` : `${saved.name} is deactivated`),
            onError: (error) => toast.error(error.message),
          },
        )
      }
    >
      {user.active ? 'Deactivate' : 'Reactivate'}
    </Button>
  );
}

/** The laser-safety officer duty: staff or admin only; the officer records and revokes training and sign-offs. */
export function OfficerToggle({ user }: { user: User }) {
  const update = useUpdateUser();
  if (user.role !== 'staff' && user.role !== 'admin') return <span className="text-xs text-ink-muted">—</span>;
  return (
    <label className="inline-flex items-center gap-2 text-sm">
      <input
        type="checkbox"
        data-testid="user-officer-toggle"
        checked={user.laserSafetyOfficer}
        disabled={update.isPending}
        onChange={(event) =>
          update.mutate(
            { id: user.id, changes: { laserSafetyOfficer: event.target.checked } },
            {
              onSuccess: ({ user: saved }) =>
                toast.success(saved.laserSafetyOfficer ? `${saved.name} is now a laser-safety officer` : `${saved.name} is no longer a laser-safety officer`),
              onError: (error) => toast.error(error.message),
            },
          )
        }
      />
      <span className="sr-only">Laser-safety officer: {user.name}</span>
    </label>
  );
}
