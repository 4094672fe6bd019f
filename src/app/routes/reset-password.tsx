import { Link, useSearchParams } from 'react-router-dom';
import { useState } from 'react';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Alert } from '../../components/ui/alert';
import { paths } from '../../config/paths';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);

  return (
    <AuthLayout title="Choose a new password">
      {done ? (
        <Alert tone="success">Your password is changed. Sign in with the new one.</Alert>
      ) : token ? (
        <ResetPasswordForm token={token} onDone={() => setDone(true)} />
      ) : (
        <Alert tone="error">This address has no reset token. Open the link from the e-mail again, or ask for a new one.</Alert>
      )}
      <p className="mt-6 flex gap-4 text-small">
        <Link to={paths.signIn.href()} className="text-hull-600 underline hover:text-hull-900">
          Sign in
        </Link>
        <Link to={paths.forgotPassword.href()} className="text-hull-600 underline hover:text-hull-900">
          Ask for a new link
        </Link>
      </p>
    </AuthLayout>
  );
}
