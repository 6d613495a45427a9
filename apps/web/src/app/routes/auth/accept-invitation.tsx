import { useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../../components/layout/auth-layout';
import { Notice } from '../../../components/ui/notice';
import { PageLoading } from '../../../components/ui/spinner';
import { defaultSignedInPath } from '../../../config/paths';
import { roleLabels } from '../../../config/roles';
import { useAcceptInvitation } from '../../../features/auth/api/accept-invitation';
import { useInvitation } from '../../../features/auth/api/get-invitation';
import { NewPasswordForm } from '../../../features/auth/components/new-password-form';
import { isApiError } from '../../../lib/api-client';

const unusable =
  'Invitations work once and expire after a while. Ask the person who invited you to send a new one.';

export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();

  if (!token) {
    return (
      <AuthLayout title="Join Femtoslot">
        <Notice tone="danger" title="This page needs the link from your invitation e-mail" testId="invitation-invalid">
          {unusable}
        </Notice>
      </AuthLayout>
    );
  }

  if (invitation.isPending) {
    return (
      <AuthLayout title="Join Femtoslot">
        <PageLoading label="Opening your invitation" />
      </AuthLayout>
    );
  }

  if (invitation.isError) {
    const gone = isApiError(invitation.error) && (invitation.error.status === 404 || invitation.error.status === 410);
    return (
      <AuthLayout title="Join Femtoslot">
        <Notice tone="danger" title={invitation.error.message} testId="invitation-invalid">
          {gone ? unusable : 'Please try again in a moment.'}
        </Notice>
      </AuthLayout>
    );
  }

  const { name, email, role, organisation } = invitation.data;
  const acceptError = accept.error && !(isApiError(accept.error) && accept.error.code === 'validation_failed') ? accept.error : null;

  return (
    <AuthLayout title={`Welcome, ${name}`} lead="Choose a password to finish setting up your account.">
      <div className="space-y-5">
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 rounded-lg bg-sunk px-3.5 py-3 text-sm" data-testid="invitation-summary">
          <dt className="text-ink-muted">Organisation</dt>
          <dd className="font-semibold">{organisation.name}</dd>
          <dt className="text-ink-muted">Role</dt>
          <dd className="font-semibold">{roleLabels[role] ?? role}</dd>
        </dl>
        {acceptError && (
          <Notice tone="danger">
            <span className="text-ink">{acceptError.message}</span>
          </Notice>
        )}
        <NewPasswordForm
          email={email}
          submitLabel="Create account and sign in"
          busy={accept.isPending}
          onSubmit={(password) =>
            accept.mutateAsync({ token, password }).then(() => navigate(defaultSignedInPath, { replace: true }))
          }
        />
      </div>
    </AuthLayout>
  );
}
