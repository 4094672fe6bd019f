import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { safeNextPath } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';

export function Component() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  const navigate = useNavigate();
  const me = useMe();

  if (me.isPending) return <LoadingState />;
  if (me.data) return <Navigate to={next} replace />;
  return (
    <AuthLayout title="Sign in to Kilowatch">
      {me.isError ? <ErrorState error={me.error} onRetry={() => void me.refetch()} title="The server did not answer" /> : null}
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
    </AuthLayout>
  );
}
