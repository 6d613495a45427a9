import { loginInputSchema, setPasswordInputSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyApiFieldErrors } from '../../../lib/form-errors';

// Built from the shared schemas so the password rule stays the API's rule.
const newPasswordFormSchema = setPasswordInputSchema
  .pick({ password: true })
  .extend({ confirmPassword: loginInputSchema.shape.password })
  .refine((values) => values.password === values.confirmPassword, {
    message: 'The two passwords do not match',
    path: ['confirmPassword'],
  });

export interface NewPasswordFormValues {
  password: string;
  confirmPassword: string;
}

export function NewPasswordForm({
  submitLabel,
  busy,
  onSubmit,
  email,
}: {
  submitLabel: string;
  busy: boolean;
  /** resolves once the request settled; reject with the API error to show field messages */
  onSubmit: (password: string) => Promise<unknown>;
  /** shown read-only so password managers file the new password under the right account */
  email?: string;
}) {
  const form = useForm<NewPasswordFormValues>({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async ({ password }) => {
    try {
      await onSubmit(password);
    } catch (error) {
      applyApiFieldErrors(error, form.setError, ['password']);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-4" data-testid="new-password-form">
      {email && (
        <TextField label="E-mail" type="email" name="email" autoComplete="username" value={email} readOnly />
      )}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={errors.password?.message}
        {...form.register('password')}
      />
      <TextField
        label="Repeat the new password"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...form.register('confirmPassword')}
      />
      <Button type="submit" busy={busy} className="w-full">
        {submitLabel}
      </Button>
    </form>
  );
}
