import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { useVessels } from '../../features/vessels/api/get-vessels';
import { useInvitations } from '../../features/users/api/get-invitations';
import { useMembers } from '../../features/users/api/get-members';
import { InvitationsTable } from '../../features/users/components/invitations-table';
import { InviteForm } from '../../features/users/components/invite-form';
import { MembersTable } from '../../features/users/components/members-table';
import { RequireCapability, useSignedIn } from '../signed-in';

function UsersPage() {
  const me = useSignedIn();
  const members = useMembers();
  const invitations = useInvitations();
  const vessels = useVessels();
  const vesselOptions = (vessels.data ?? []).map((v) => ({ id: v.id, name: v.name }));

  return (
    <>
      <PageHeader title="Users and invitations" description={`Who works with ${me.company.name} in Kilowatch, and in which role.`} />
      <div className="flex flex-col gap-6">
        <Panel title="Members">
          <QueryView
            query={members}
            loadingLabel="Loading members…"
            isEmpty={(list) => list.length === 0}
            empty={<EmptyState title="No members" next="Invite the first colleague with the form below." />}
          >
            {(list) => <MembersTable members={list} vessels={vesselOptions} currentUserId={me.user.id} />}
          </QueryView>
        </Panel>
        <Panel title="Invite a person">
          <InviteForm vessels={vesselOptions} />
        </Panel>
        <Panel title="Pending invitations">
          <QueryView query={invitations} loadingLabel="Loading invitations…">
            {(list) => <InvitationsTable invitations={list} vessels={vesselOptions} />}
          </QueryView>
        </Panel>
      </div>
    </>
  );
}

export function Component() {
  return (
    <RequireCapability capability="users:manage" title="Users and invitations">
      <UsersPage />
    </RequireCapability>
  );
}
