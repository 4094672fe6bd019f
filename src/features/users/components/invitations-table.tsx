import { ROLE_LABELS } from '../../../../shared/roles';
import type { Invitation } from '../../../../shared/schemas/users';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { useDeleteInvitation } from '../api/delete-invitation';
import type { VesselOption } from './membership-fields';

/** Pending invitations with a revoke button; answered, expired and revoked ones are not listed. */
export function InvitationsTable({ invitations, vessels }: { invitations: Invitation[]; vessels: VesselOption[] }) {
  const revoke = useDeleteInvitation();
  const vesselName = new Map(vessels.map((v) => [v.id, v.name]));
  const pending = invitations.filter((i) => i.status === 'pending');

  if (pending.length === 0) {
    return <EmptyState title="No pending invitations" next="Invite a colleague with the form above; the invitation shows here until it is accepted." />;
  }
  return (
    <>
      {revoke.isError ? <p className="mb-2 text-small text-signal-600">{errorMessage(revoke.error)}</p> : null}
      <Table caption="Pending invitations">
        <thead>
          <tr>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Vessels</Th>
            <Th>Open until</Th>
            <Th className="text-right">Actions</Th>
          </tr>
        </thead>
        <tbody>
          {pending.map((inv) => (
            <tr key={inv.id} data-invitation={inv.email}>
              <Td>{inv.email}</Td>
              <Td>
                <Badge>{ROLE_LABELS[inv.role]}</Badge>
              </Td>
              <Td>{inv.vesselIds.length === 0 ? 'all' : inv.vesselIds.map((id) => vesselName.get(id) ?? 'unknown vessel').join(', ')}</Td>
              <Td>{formatDateTime(inv.expiresAt)}</Td>
              <Td className="text-right">
                <Button
                  variant="quiet"
                  size="sm"
                  onClick={() => revoke.mutate(inv.id)}
                  pending={revoke.isPending && revoke.variables === inv.id}
                  pendingLabel="Revoking…"
                  aria-label={`Revoke the invitation to ${inv.email}`}
                >
                  Revoke
                </Button>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </>
  );
}
