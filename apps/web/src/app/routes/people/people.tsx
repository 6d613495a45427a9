import { invitableRolesBy } from '@femtoslot/shared';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useOrganisations } from '../../../features/organisations/api/get-organisations';
import { useUsers } from '../../../features/people/api/get-users';
import { InviteUserDialog } from '../../../features/people/components/invite-user-dialog';
import { UsersTable } from '../../../features/people/components/users-table';
import { useSignedInUser } from '../../../lib/auth';

export function PeoplePage() {
  const me = useSignedInUser();
  const users = useUsers();
  const facility = useFacility();
  const [inviting, setInviting] = useState(false);
  const organisations = useOrganisations();

  return (
    <>
      <PageHeader
        title="People"
        lead="Everyone with an account, their role and organisation."
        actions={
          <Button onClick={() => setInviting(true)} data-testid="invite-user-button">
            Invite someone
          </Button>
        }
      />
      {users.isPending && <PageLoading label="Loading people" />}
      {users.isError && (
        <Notice tone="danger" title="The list of people could not be loaded">
          {users.error.message}
        </Notice>
      )}
      {users.data && <UsersTable users={users.data} currentUserId={me.id} timeZone={facility.data?.timeZone} />}
      <InviteUserDialog
        open={inviting}
        onClose={() => setInviting(false)}
        organisations={organisations.data ?? []}
        organisationsLoading={organisations.isPending}
        organisationsError={organisations.error?.message}
        invitableRoles={invitableRolesBy[me.role]}
      />
    </>
  );
}
