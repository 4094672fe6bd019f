import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { signInSchema, type Me } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useServerErrors } from '../../../lib/form-errors';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const signIn = useSignIn();
  const form = useForm({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const server = useServerErrors(form.setError, ['email', 'password'], (error) => {
    if (isApiError(error, 401)) return 'The e-mail address or the password is wrong.';
    if (isApiError(error, 429)) return `${error.message} Wait a few minutes before trying again.`;
    return null;
  });

  const submit = form.handleSubmit((values) => {
    server.clear();
    signIn.mutate(values, { onSuccess: onSignedIn, onError: server.onError });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <Field label="E-mail address" htmlFor="sign-in-email" error={errors.email?.message}>
        <Input id="sign-in-email" type="email" autoComplete="username" invalid={!!errors.email} {...form.register('email')} />
      </Field>
      <Field label="Password" htmlFor="sign-in-password" error={errors.password?.message}>
        <Input id="sign-in-password" type="password" autoComplete="current-password" invalid={!!errors.password} {...form.register('password')} />
      </Field>
      <Button type="submit" pending={signIn.isPending} pendingLabel="Signing in…">
        Sign in
      </Button>
      <Link to={paths.forgotPassword.href()} className="text-small text-hull-600 underline hover:text-hull-900">
        Forgot your password?
      </Link>
    </form>
  );
}
