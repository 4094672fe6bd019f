import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Alert } from '../../components/ui/alert';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';
import { useInvitationPreview } from '../../features/auth/api/get-invitation-preview';
import { AcceptInvitationForm } from '../../features/auth/components/accept-invitation-form';

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const preview = useInvitationPreview(token);

  const body = (() => {
    if (!token) return <Alert tone="error">This address has no invitation token. Open the link from the invitation e-mail again.</Alert>;
    if (preview.isPending) return <LoadingState label="Checking the invitation…" />;
    if (preview.isError) {
      return isApiError(preview.error, 404) ? (
        <Alert tone="error">This invitation is unknown, used or expired. Ask the person who invited you to send a new one.</Alert>
      ) : (
        <ErrorState error={preview.error} onRetry={() => void preview.refetch()} />
      );
    }
    return <AcceptInvitationForm token={token} preview={preview.data} onAccepted={() => navigate(paths.fleet.href(), { replace: true })} />;
  })();

  return (
    <AuthLayout title="Join your team on Kilowatch">
      {body}
      <p className="mt-6 text-small">
        <Link to={paths.signIn.href()} className="text-hull-600 underline hover:text-hull-900">
          Already have an account? Sign in
        </Link>
      </p>
    </AuthLayout>
  );
}
