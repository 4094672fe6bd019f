import { Link } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { paths } from '../../config/paths';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export function Component() {
  return (
    <AuthLayout title="Reset your password">
      <p className="mb-4 text-small text-hull-700">Enter the address you sign in with. We send a link to choose a new password.</p>
      <ForgotPasswordForm />
      <p className="mt-6 text-small">
        <Link to={paths.signIn.href()} className="text-hull-600 underline hover:text-hull-900">
          Back to sign-in
        </Link>
      </p>
    </AuthLayout>
  );
}
