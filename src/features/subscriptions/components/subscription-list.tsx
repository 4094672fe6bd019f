import { SUBSCRIPTION_LABELS, type SubscriptionRow } from '../../../../shared/schemas/reports';
import { Button } from '../../../components/ui/button';
import { ErrorState, QueryView, EmptyState } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDateTime, formatHours } from '../../../lib/format';
import { useDeleteSubscription } from '../api/delete-subscription';
import { useSubscriptions } from '../api/get-subscriptions';

function Rows({ rows }: { rows: SubscriptionRow[] }) {
  const remove = useDeleteSubscription();
  return (
    <>
      {remove.isError ? <ErrorState error={remove.error} title="The subscription could not be ended" /> : null}
      <Table caption="Your subscriptions">
        <thead>
          <tr>
            <Th>What</Th>
            <Th>Vessel</Th>
            <Th numeric>Hours before due (h)</Th>
            <Th>Since</Th>
            <Th>Last sent</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((s) => (
            <tr key={s.id} data-subscription={s.kind}>
              <Td>{SUBSCRIPTION_LABELS[s.kind]}</Td>
              <Td>{s.kind === 'fleet_monthly_report' ? 'Fleet' : (s.vesselName ?? 'Every vessel you may see')}</Td>
              <Td numeric>{s.kind === 'overhaul_alert' ? (s.hoursBefore === null ? 'standard' : formatHours(s.hoursBefore)) : '–'}</Td>
              <Td>{formatDateTime(s.createdAt)}</Td>
              <Td>{s.lastDeliveredAt ? formatDateTime(s.lastDeliveredAt) : 'not yet'}</Td>
              <Td>
                <Button
                  size="sm"
                  variant="secondary"
                  pending={remove.isPending && remove.variables === s.id}
                  pendingLabel="Ending…"
                  onClick={() => remove.mutate(s.id)}
                  data-action="unsubscribe"
                >
                  Unsubscribe
                </Button>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </>
  );
}

/** The signed-in member's subscriptions, each with an unsubscribe button. */
export function SubscriptionList() {
  const subs = useSubscriptions();
  return (
    <QueryView
      query={subs}
      loadingLabel="Loading your subscriptions…"
      isEmpty={(rows) => rows.length === 0}
      empty={<EmptyState title="No subscriptions yet" next="Subscribe above to receive a monthly report or an alert by e-mail." />}
    >
      {(rows) => <Rows rows={rows} />}
    </QueryView>
  );
}
