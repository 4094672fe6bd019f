import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { LIMITS } from '../../../../shared/limits';
import { resetPasswordSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { isApiError } from '../../../lib/api-client';
import { useServerErrors } from '../../../lib/form-errors';
import { useResetPassword } from '../api/reset-password';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const form = useForm({ resolver: zodResolver(resetPasswordSchema), defaultValues: { token, password: '' } });
  const { errors } = form.formState;

  const server = useServerErrors(form.setError, ['password'], (error) =>
    isApiError(error, 400) && error.fieldIssues.length === 0 ? 'This reset link is no longer valid. Ask for a new one.' : null,
  );

  return (
    <form onSubmit={form.handleSubmit((values) => {
        server.clear();
        reset.mutate(values, { onSuccess: onDone, onError: server.onError });
      })} noValidate className="flex flex-col gap-4" aria-label="Choose a new password">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
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
