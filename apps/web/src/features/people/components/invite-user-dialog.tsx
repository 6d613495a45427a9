import { type InviteInput, type Organisation, type Role, inviteInputSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { roleLabels } from '../../../config/roles';
import { applyApiFieldErrors } from '../../../lib/form-errors';
import { useInviteUser } from '../api/invite-user';

const organisationKindLabels: Record<Organisation['kind'], string> = {
  internal: 'internal',
  external_academic: 'external academic',
  industry: 'industry',
};

export interface InviteUserDialogProps {
  open: boolean;
  onClose: () => void;
  organisations: Organisation[];
  organisationsLoading?: boolean;
  organisationsError?: string;
  /** roles the signed-in person may hand out */
  invitableRoles: readonly Role[];
}

const fields = ['email', 'name', 'role', 'organisationId'] as const;

export function InviteUserDialog({
  open,
  onClose,
  organisations,
  organisationsLoading,
  organisationsError,
  invitableRoles,
}: InviteUserDialogProps) {
  const invite = useInviteUser();
  const form = useForm<InviteInput>({
    resolver: zodResolver(inviteInputSchema),
    defaultValues: { email: '', name: '', role: invitableRoles.includes('member') ? 'member' : invitableRoles[0], organisationId: '' },
  });
  const { errors } = form.formState;

  const close = () => {
    form.reset();
    invite.reset();
    onClose();
  };

  const onSubmit = form.handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: ({ user }) => {
        toast.success(`Invitation sent to ${user.email}`);
        close();
      },
      onError: (error) => {
        if (applyApiFieldErrors(error, form.setError, fields)) {
          toast.error('Check the highlighted fields');
        } else {
          toast.error(error.message);
        }
      },
    }),
  );

  return (
    <Dialog
      open={open}
      onClose={close}
      title="Invite someone"
      description="They receive an e-mail with a link to choose a password."
      testId="invite-dialog"
    >
      <form onSubmit={onSubmit} noValidate className="space-y-4">
        {organisationsError && (
          <Notice tone="danger" title="Organisations could not be loaded">
            {organisationsError}
          </Notice>
        )}
        <TextField label="Name" autoComplete="off" autoFocus error={errors.name?.message} {...form.register('name')} />
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
        <SelectField label="Role" error={errors.role?.message} {...form.register('role')}>
          {invitableRoles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Organisation"
          disabled={organisationsLoading}
          error={
            errors.organisationId &&
            (errors.organisationId.type === 'server' ? errors.organisationId.message : 'Choose an organisation')
          }
          {...form.register('organisationId')}
        >
          <option value="">{organisationsLoading ? 'Loading organisations…' : 'Choose an organisation'}</option>
          {organisations.map((organisation) => (
            <option key={organisation.id} value={organisation.id}>
              {organisation.name} ({organisationKindLabels[organisation.kind] ?? organisation.kind})
            </option>
          ))}
        </SelectField>
        <div className="flex justify-end gap-2 pt-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" busy={invite.isPending}>
            Send invitation
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
