import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { LIMITS, resetPasswordSchema } from '../../../../shared';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { useResetPassword } from '../api/reset-password';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const form = useForm({ resolver: zodResolver(resetPasswordSchema), defaultValues: { token, password: '' } });
  const { errors } = form.formState;

  const problem = (() => {
    if (!reset.isError) return null;
    if (isApiError(reset.error, 400) && reset.error.fieldIssues.length === 0) return 'This reset link is no longer valid. Ask for a new one.';
    return applyServerErrors(reset.error, form.setError, ['password']);
  })();

  return (
    <form onSubmit={form.handleSubmit((values) => reset.mutate(values, { onSuccess: onDone }))} noValidate className="flex flex-col gap-4" aria-label="Choose a new password">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      {errors.token ? <Alert tone="error">This reset link is incomplete. Open the link from the e-mail again.</Alert> : null}
      <Field label="New password" htmlFor="reset-password" error={errors.password?.message} hint={`At least ${LIMITS.passwordMinLength} characters.`}>
        <Input id="reset-password" type="password" autoComplete="new-password" invalid={!!errors.password} {...form.register('password')} />
      </Field>
      <Button type="submit" pending={reset.isPending} pendingLabel="Saving…">
        Save new password
      </Button>
    </form>
  );
}
