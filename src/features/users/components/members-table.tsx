import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ROLE_LABELS } from '../../../../shared/roles';
import { updateMemberSchema, type Member, type UpdateMemberInput } from '../../../../shared/schemas/users';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Select } from '../../../components/ui/form-field';
import { Table, Td, Th } from '../../../components/ui/table';
import { errorMessage } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { useDeleteMember } from '../api/delete-member';
import { useUpdateMember } from '../api/update-member';
import { RoleOptions, VesselScopeField, withVesselScope, type VesselOption } from './membership-fields';

function RoleEditor({ member, vessels, onClose }: { member: Member; vessels: VesselOption[]; onClose: () => void }) {
  const update = useUpdateMember();
  const form = useForm<UpdateMemberInput, unknown, z.output<typeof updateMemberSchema>>({
    resolver: zodResolver(updateMemberSchema),
    defaultValues: { role: member.role, vesselIds: member.vesselIds ?? [] },
  });
  const role = form.watch('role');
  const server = useServerErrors(form.setError, ['role', 'vesselIds']);
  const submit = form.handleSubmit((input) => {
    server.clear();
    update.mutate({ membershipId: member.membershipId, input: withVesselScope(input) }, { onSuccess: onClose, onError: server.onError });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-plate bg-deck-50 p-3" aria-label={`Change the role of ${member.name}`}>
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <Field label="Role" htmlFor={`role-${member.membershipId}`} error={form.formState.errors.role?.message} className="max-w-xs">
        <Select id={`role-${member.membershipId}`} {...form.register('role')}>
          <RoleOptions />
        </Select>
      </Field>
      <VesselScopeField control={form.control} name="vesselIds" role={role} id={`vessels-${member.membershipId}`} vessels={vessels} />
      <FormActions submitLabel="Save role" size="sm" pending={update.isPending} onCancel={onClose} />
    </form>
  );
}

interface MembersTableProps {
  members: Member[];
  vessels: VesselOption[];
  /** The signed-in user, who cannot remove or demote themself here. */
  currentUserId: string;
}

export function MembersTable({ members, vessels, currentUserId }: MembersTableProps) {
  const [editing, setEditing] = useState<string | null>(null);
  const remove = useDeleteMember();
  const vesselName = new Map(vessels.map((v) => [v.id, v.name]));

  return (
    <>
      {remove.isError ? <Alert tone="error">{errorMessage(remove.error)}</Alert> : null}
      <Table caption="Members of the company">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Vessels</Th>
            <Th>Member since</Th>
            <Th className="text-right">Actions</Th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => {
            const self = m.userId === currentUserId;
            return (
              <tr key={m.membershipId} data-member={m.email}>
                <Td className="font-semibold text-hull-900">
                  {m.name}
                  {self ? <span className="font-normal text-hull-500"> (you)</span> : null}
                </Td>
                <Td>{m.email}</Td>
                <Td>
                  {editing === m.membershipId ? (
                    <RoleEditor member={m} vessels={vessels} onClose={() => setEditing(null)} />
                  ) : (
                    <Badge tone={m.role === 'admin' ? 'accent' : 'neutral'}>{ROLE_LABELS[m.role]}</Badge>
                  )}
                </Td>
                <Td>{m.vesselIds === null ? 'all' : m.vesselIds.map((id) => vesselName.get(id) ?? 'unknown vessel').join(', ')}</Td>
                <Td>{formatDate(m.createdAt)}</Td>
                <Td className="whitespace-nowrap text-right">
                  {self || editing === m.membershipId ? null : (
                    <>
                      <Button variant="secondary" size="sm" onClick={() => setEditing(m.membershipId)}>
                        Change role
                      </Button>{' '}
                      <Button
                        variant="quiet"
                        size="sm"
                        onClick={() => {
                          if (window.confirm(`Remove ${m.name} from the company? They lose access at once.`)) remove.mutate(m.membershipId);
                        }}
                        pending={remove.isPending && remove.variables === m.membershipId}
                        pendingLabel="Removing…"
                      >
                        Remove
                      </Button>
                    </>
                  )}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
    </>
  );
}
