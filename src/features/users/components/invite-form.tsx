import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { createInvitationSchema, type CreateInvitationInput } from '../../../../shared/schemas/users';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { useCreateInvitation } from '../api/create-invitation';
import { RoleOptions, VesselScopeField, withVesselScope, type VesselOption } from './membership-fields';

/** Invites a person by e-mail; the message waits in the outbox until the mail relay sends it. */
export function InviteForm({ vessels }: { vessels: VesselOption[] }) {
  const create = useCreateInvitation();
  const form = useForm<CreateInvitationInput, unknown, z.output<typeof createInvitationSchema>>({
    resolver: zodResolver(createInvitationSchema),
    defaultValues: { email: '', role: 'chief_engineer', vesselIds: [] },
  });
  const { errors } = form.formState;
  const role = form.watch('role');
  const server = useServerErrors(form.setError, ['email', 'role', 'vesselIds']);

  const submit = form.handleSubmit((input) => {
    server.clear();
    create.mutate(withVesselScope(input), { onSuccess: () => form.reset({ email: '', role: input.role, vesselIds: [] }), onError: server.onError });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Invite a person" data-form="invite">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      {create.isSuccess ? <Alert tone="success">Invitation to {create.data.email} created; the e-mail is in the outbox.</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="E-mail address" htmlFor="invite-email" error={errors.email?.message}>
          <Input id="invite-email" type="email" invalid={!!errors.email} {...form.register('email')} />
        </Field>
        <Field label="Role" htmlFor="invite-role" error={errors.role?.message}>
          <Select id="invite-role" {...form.register('role')}>
            <RoleOptions />
          </Select>
        </Field>
      </div>
      <VesselScopeField control={form.control} name="vesselIds" role={role} id="invite-vessels" legend="Vessels this chief engineer acts on" vessels={vessels} />
      <div>
        <Button type="submit" pending={create.isPending} pendingLabel="Inviting…">
          Send invitation
        </Button>
      </div>
    </form>
  );
}
