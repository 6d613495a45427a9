import { type LoginInput, loginInputSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { paths } from '../../../config/paths';
import { applyApiFieldErrors, isValidationFailure } from '../../../lib/form-errors';
import { useLogin } from '../api/login';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const login = useLogin();
  const form = useForm<LoginInput>({ resolver: zodResolver(loginInputSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) =>
    login.mutate(values, {
      onSuccess: onSignedIn,
      onError: (error) => {
        applyApiFieldErrors(error, form.setError, ['email', 'password']);
        form.resetField('password', { keepError: true });
      },
    }),
  );

  const failure = login.error && !isValidationFailure(login.error) ? login.error : null;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="sign-in-form">
      {failure && (
        <Notice tone="danger" testId="sign-in-error">
          <span className="text-ink">{failure.message}</span>
        </Notice>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        autoFocus
        error={errors.email?.message}
        {...form.register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" busy={login.isPending} className="w-full">
        Sign in
      </Button>
      <p className="text-center text-sm">
        <Link to={paths.forgotPassword} className="font-semibold text-accent underline-offset-4 hover:underline">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
