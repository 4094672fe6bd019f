import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { LIMITS } from '../../../../shared/limits';
import { ROLE_LABELS } from '../../../../shared/roles';
import { acceptInvitationSchema, type InvitationPreview, type Me } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { formatDateTime } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';

interface Props {
  token: string;
  preview: InvitationPreview;
  onAccepted: (me: Me) => void;
}

export function AcceptInvitationForm({ token, preview, onAccepted }: Props) {
  const accept = useAcceptInvitation();
  const form = useForm({ resolver: zodResolver(acceptInvitationSchema), defaultValues: { token, name: '', password: '' } });
  const { errors } = form.formState;
  const server = useServerErrors(form.setError, ['name', 'password']);
  const submit = form.handleSubmit((values) => {
    server.clear();
    accept.mutate(values, { onSuccess: onAccepted, onError: server.onError });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Accept the invitation">
      <p className="text-small text-hull-700">
        <strong>{preview.companyName}</strong> invites <strong>{preview.email}</strong> to join as {ROLE_LABELS[preview.role].toLowerCase()}. The invitation
        is open until {formatDateTime(preview.expiresAt)}.
      </p>
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <Field label="Your name" htmlFor="accept-name" error={errors.name?.message}>
        <Input id="accept-name" autoComplete="name" invalid={!!errors.name} {...form.register('name')} />
      </Field>
      <Field label="Choose a password" htmlFor="accept-password" error={errors.password?.message} hint={`At least ${LIMITS.passwordMinLength} characters.`}>
        <Input id="accept-password" type="password" autoComplete="new-password" invalid={!!errors.password} {...form.register('password')} />
      </Field>
      <Button type="submit" pending={accept.isPending} pendingLabel="Joining…">
        Join {preview.companyName}
      </Button>
    </form>
  );
}
