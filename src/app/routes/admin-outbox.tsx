import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { EmptyState, QueryView } from '../../components/ui/states';
import { useOutbox } from '../../features/outbox/api/get-outbox';
import { OutboxList } from '../../features/outbox/components/outbox-list';
import { RequireCapability } from '../signed-in';

function OutboxPage() {
  const outbox = useOutbox();
  return (
    <>
      <PageHeader
        title="Outbox"
        description="E-mails Kilowatch has queued for the mail relay: invitations and password resets."
        actions={
          <Button variant="secondary" onClick={() => void outbox.refetch()} pending={outbox.isFetching && !outbox.isPending} pendingLabel="Refreshing…">
            Refresh
          </Button>
        }
      />
      <QueryView
        query={outbox}
        loadingLabel="Loading the outbox…"
        isEmpty={(list) => list.length === 0}
        empty={<EmptyState title="The outbox is empty" next="Invite a colleague on the Users page; the invitation e-mail will show here." />}
      >
        {(list) => <OutboxList messages={list} />}
      </QueryView>
    </>
  );
}

export function Component() {
  return (
    <RequireCapability capability="outbox:read" title="Outbox">
      <OutboxPage />
    </RequireCapability>
  );
}
