import { type ForgotPasswordInput, forgotPasswordInputSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { paths } from '../../../config/paths';
import { applyApiFieldErrors, isValidationFailure } from '../../../lib/form-errors';
import { useRequestPasswordReset } from '../api/forgot-password';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm<ForgotPasswordInput>({ resolver: zodResolver(forgotPasswordInputSchema), defaultValues: { email: '' } });

  const onSubmit = form.handleSubmit((values) =>
    request.mutate(values, { onError: (error) => applyApiFieldErrors(error, form.setError, ['email']) }),
  );

  if (request.isSuccess) {
    return (
      <div className="space-y-4">
        <Notice tone="success" testId="forgot-password-sent" title="Check your inbox">
          If that address has an account, a reset link is on its way.
        </Notice>
        <BackToSignIn />
      </div>
    );
  }

  const failure = request.error && !isValidationFailure(request.error) ? request.error : null;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="forgot-password-form">
      {failure && (
        <Notice tone="danger">
          <span className="text-ink">{failure.message}</span>
        </Notice>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        autoFocus
        error={form.formState.errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit" busy={request.isPending} className="w-full">
        Send reset link
      </Button>
      <BackToSignIn />
    </form>
  );
}

function BackToSignIn() {
  return (
    <p className="text-center text-sm">
      <Link to={paths.signIn} className="font-semibold text-accent underline-offset-4 hover:underline">
        Back to sign in
      </Link>
    </p>
  );
}
