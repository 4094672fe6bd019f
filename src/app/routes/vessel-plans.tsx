import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { Table, Td, Th } from '../../components/ui/table';
import { paths } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useApprovePlan } from '../../features/plans/api/approve-plan';
import { usePlan } from '../../features/plans/api/get-plan';
import { usePlans } from '../../features/plans/api/get-plans';
import { useResolvePlan } from '../../features/plans/api/resolve-plan';
import { PlanForm } from '../../features/plans/components/plan-form';
import { PlanView } from '../../features/plans/components/plan-view';
import { useVessel } from '../../features/vessels/api/get-vessel';
import { useOperatingRules } from '../../features/recommendations/api/get-operating-rules';
import { usePlantModel } from '../../features/recommendations/api/get-plant-model';
import { Caution } from '../../features/recommendations/components/caution';
import { formatDate, formatKg } from '../../lib/format';
import { can } from '../../../shared/roles';

function OnePlan({ vesselId, planId, onOpen }: { vesselId: string; planId: string; onOpen: (id: string) => void }) {
  const plan = usePlan(vesselId, planId);
  const approve = useApprovePlan();
  const resolve = useResolvePlan();
  const me = useMe();
  return (
    <QueryView query={plan} loadingLabel="Loading the plan…">
      {(p) => (
        <PlanView
          plan={p}
          canApprove={!!me.data && can(me.data.role, 'plans:approve')}
          approving={approve.isPending}
          onApprove={() => approve.mutate({ vesselId, planId })}
          onResolve={() => resolve.mutate({ vesselId, planId }, { onSuccess: (n) => onOpen(n.id) })}
        />
      )}
    </QueryView>
  );
}

/** The plan form with what it needs from the plant (bus section names, the modes whose bus tie is open) and the vessel's latest log. */
function NewPlan({ vesselId, onCreated }: { vesselId: string; onCreated: (id: string) => void }) {
  const plant = usePlantModel(vesselId);
  const rules = useOperatingRules(vesselId);
  const vessel = useVessel(vesselId);
  return (
    <QueryView query={plant} loadingLabel="Loading the plant…">
      {(p) => (
        <QueryView query={rules} loadingLabel="Loading the operating rules…">
          {(r) => (
            <QueryView query={vessel} loadingLabel="Loading the vessel…">
              {(v) => <PlanForm vesselId={vesselId} busSections={p.busSections} openTieModes={r.rules.filter((x) => !x.busTieClosed).map((x) => x.mode)} onCreated={onCreated} lastLogDate={v.lastLogDate} />}
            </QueryView>
          )}
        </QueryView>
      )}
    </QueryView>
  );
}

/** Voyage plans: a load profile over up to 30 days, solved in the background, compared with the PMS baseline. */
export function Component() {
  const { vesselId = '' } = useParams();
  const plans = usePlans(vesselId);
  const [open, setOpen] = useState<string | null>(null);
  return (
    <div className="space-y-4">
      <PageHeader
        title="Voyage plans"
        description="Which sets to run in every period and how to share the load, with the distance from the optimum stated."
        actions={
          <Link to={paths.vesselRules.href(vesselId)} className="text-small font-semibold underline" data-action="open-rules">
            Operating rules (reserve, bus tie)
          </Link>
        }
      />
      <Caution />
      <Panel title="New plan">
        <NewPlan vesselId={vesselId} onCreated={setOpen} />
      </Panel>
      {open ? <OnePlan vesselId={vesselId} planId={open} onOpen={setOpen} /> : null}
      <Panel title="Saved plans">
        <QueryView query={plans} isEmpty={(l) => l.length === 0} empty={<EmptyState title="No plans yet" next="Enter or build a load profile above and press Plan; solved plans are kept here." />}>
          {(list) => (
            <Table caption="Saved plans">
              <thead>
                <tr>
                  <Th>Name</Th>
                  <Th>Status</Th>
                  <Th numeric>Fuel</Th>
                  <Th numeric>Saving</Th>
                  <Th>Created</Th>
                </tr>
              </thead>
              <tbody>
                {list.map((p) => (
                  <tr key={p.id} onClick={() => setOpen(p.id)} className="cursor-pointer">
                    <Td>{p.name}</Td>
                    <Td>{p.status}{p.statusText ? ` (${p.statusText})` : ''}</Td>
                    <Td numeric>{formatKg(p.totalFuelKg)}</Td>
                    <Td numeric>{formatKg(p.savingFuelKg)}</Td>
                    <Td>{formatDate(p.createdAt)}</Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </QueryView>
      </Panel>
    </div>
  );
}
