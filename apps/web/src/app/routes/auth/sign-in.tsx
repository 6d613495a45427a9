import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { AuthLayout } from '../../../components/layout/auth-layout';
import { SignInForm } from '../../../features/auth/components/sign-in-form';
import { type SignInRedirectState, useCurrentUser } from '../../../lib/auth';
import { safeRedirect } from './safe-redirect';

export function SignInPage() {
  const location = useLocation();
  const navigate = useNavigate();
  const { data: user } = useCurrentUser();
  const target = safeRedirect((location.state as SignInRedirectState | null)?.from);

  if (user) return <Navigate to={target} replace />;

  return (
    <AuthLayout title="Sign in" lead="Use the e-mail address your facility invited.">
      <SignInForm onSignedIn={() => navigate(target, { replace: true })} />
    </AuthLayout>
  );
}
