import { AuthLayout } from '../../../components/layout/auth-layout';
import { ForgotPasswordForm } from '../../../features/auth/components/forgot-password-form';

export function ForgotPasswordPage() {
  return (
    <AuthLayout title="Reset your password" lead="Enter your e-mail address and we will send a link to choose a new password.">
      <ForgotPasswordForm />
    </AuthLayout>
  );
}
