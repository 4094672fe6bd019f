import { can } from '../../../shared/roles';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { QueryView } from '../../components/ui/states';
import { SubscribeForm } from '../../features/subscriptions/components/subscribe-form';
import { SubscriptionList } from '../../features/subscriptions/components/subscription-list';
import { useVessels } from '../../features/vessels/api/get-vessels';
import { useSignedIn } from '../signed-in';

/** Every member's own e-mail subscriptions: monthly reports, drift alerts and overhaul-due alerts. */
export function Component() {
  const me = useSignedIn();
  const vessels = useVessels();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Subscriptions" description={`Reports and alerts sent to ${me.user.email} by e-mail.`} />
      <Panel title="Subscribe">
        <QueryView query={vessels} loadingLabel="Loading your vessels…">
          {(list) => <SubscribeForm vessels={list} mayReceiveFleetReport={can(me.role, 'reports:read')} />}
        </QueryView>
      </Panel>
      <Panel title="Your subscriptions">
        <SubscriptionList />
      </Panel>
    </div>
  );
}
