import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../../components/layout/auth-layout';
import { Notice } from '../../../components/ui/notice';
import { defaultSignedInPath, paths } from '../../../config/paths';
import { useResetPassword } from '../../../features/auth/api/reset-password';
import { NewPasswordForm } from '../../../features/auth/components/new-password-form';
import { isApiError } from '../../../lib/api-client';

function RequestNewLink() {
  return (
    <Link to={paths.forgotPassword} className="font-semibold text-accent underline-offset-4 hover:underline">
      Request a new reset link
    </Link>
  );
}

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const reset = useResetPassword();

  if (!token) {
    return (
      <AuthLayout title="Choose a new password">
        <Notice tone="danger" title="This page needs the link from your e-mail" testId="reset-invalid-token">
          Open the reset link from the message we sent, or <RequestNewLink />.
        </Notice>
      </AuthLayout>
    );
  }

  const error = reset.error;
  const tokenRejected =
    isApiError(error) &&
    (error.code === 'invalid_token' ||
      (error.code === 'validation_failed' && JSON.stringify(error.details ?? '').includes('token')));

  return (
    <AuthLayout title="Choose a new password" lead="You will be signed in once it is saved.">
      <div className="space-y-4">
        {tokenRejected && (
          <Notice tone="danger" title="This reset link has expired or was already used" testId="reset-invalid-token">
            Reset links work once and for a limited time. <RequestNewLink />.
          </Notice>
        )}
        {error && !tokenRejected && !(isApiError(error) && error.code === 'validation_failed') && (
          <Notice tone="danger">
            <span className="text-ink">{error.message}</span>
          </Notice>
        )}
        <NewPasswordForm
          submitLabel="Save password and sign in"
          busy={reset.isPending}
          onSubmit={(password) =>
            reset.mutateAsync({ token, password }).then(() => navigate(defaultSignedInPath, { replace: true }))
          }
        />
      </div>
    </AuthLayout>
  );
}
