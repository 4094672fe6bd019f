import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { forgotPasswordSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { useRequestPasswordReset } from '../api/forgot-password';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm({ resolver: zodResolver(forgotPasswordSchema), defaultValues: { email: '' } });
  const { errors } = form.formState;
  const server = useServerErrors(form.setError, ['email']);

  if (request.isSuccess) {
    return (
      <Alert tone="success">
        If an account uses that address, a message with a reset link is on its way. The link works for a short time only;
        open it on this device.
      </Alert>
    );
  }


  return (
    <form onSubmit={form.handleSubmit((values) => {
        server.clear();
        request.mutate(values, { onError: server.onError });
      })} noValidate className="flex flex-col gap-4" aria-label="Request a password reset">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <Field label="E-mail address" htmlFor="forgot-email" error={errors.email?.message}>
        <Input id="forgot-email" type="email" autoComplete="username" invalid={!!errors.email} {...form.register('email')} />
      </Field>
      <Button type="submit" pending={request.isPending} pendingLabel="Sending…">
        Send reset link
      </Button>
    </form>
  );
}
