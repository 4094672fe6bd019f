import { Link, useParams } from 'react-router-dom';
import { can } from '../../../shared/roles';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { useOperatingRules } from '../../features/recommendations/api/get-operating-rules';
import { usePlantModel } from '../../features/recommendations/api/get-plant-model';
import { Caution } from '../../features/recommendations/components/caution';
import { GensetStatusForm } from '../../features/recommendations/components/genset-status-form';
import { OperatingRuleForm } from '../../features/recommendations/components/operating-rule-form';
import { useSignedIn } from '../signed-in';

/** Operating rules per mode (reserve, minimum sets, N-1, bus tie) and each set's status, as recommendations see them. */
export function Component() {
  const { vesselId = '' } = useParams();
  const me = useSignedIn();
  const rules = useOperatingRules(vesselId);
  const plant = usePlantModel(vesselId);
  const mayEditRules = can(me.role, 'plant:edit');
  const maySetStatus = can(me.role, 'plant:status');
  return (
    <div className="space-y-4">
      <PageHeader
        title="Operating rules and set status"
        description="What every recommendation, guideline and voyage plan of this vessel must respect."
        actions={
          <>
            <Link to={paths.vessel.href(vesselId)} className="text-small font-semibold underline" data-action="open-vessel">
              Vessel
            </Link>
            <Link to={paths.vesselRecommend.href(vesselId)} className="text-small font-semibold underline" data-action="open-recommend">
              Recommend for a load
            </Link>
          </>
        }
      />
      <Panel title="Spinning reserve per operating mode">
        <div className="mb-4">
          <Caution />
        </div>
        {!mayEditRules ? <p className="mb-3 text-small text-hull-600">Shown for reference: the chief engineer or the superintendent sets these rules.</p> : null}
        <QueryView query={rules} loadingLabel="Loading the operating rules…">
          {(r) => (
            <div className="grid gap-6 lg:grid-cols-2">
              {r.rules.map((rule) => (
                <div key={rule.mode} className="rounded-plate border border-deck-200 p-4">
                  <OperatingRuleForm vesselId={vesselId} rule={rule} canEdit={mayEditRules} />
                </div>
              ))}
            </div>
          )}
        </QueryView>
      </Panel>
      <Panel title="Set status">
        {!maySetStatus ? <p className="mb-3 text-small text-hull-600">Shown for reference: the chief engineer or the superintendent marks sets unavailable or must-run.</p> : null}
        <QueryView
          query={plant}
          loadingLabel="Loading the sets…"
          isEmpty={(p) => p.units.length === 0 && p.leftOut.length === 0}
          empty={<EmptyState title="No service sets" next="Add the vessel's generator sets to its genset register first." />}
        >
          {(p) => (
            <div className="space-y-4">
              <ul className="divide-y divide-deck-100">
                {p.units.map((u) => (
                  <li key={u.gensetId} className="py-3">
                    <GensetStatusForm vesselId={vesselId} unit={u} canEdit={maySetStatus} />
                  </li>
                ))}
              </ul>
              {p.leftOut.length ? (
                <p className="text-small text-hull-600">
                  Not in recommendations: {p.leftOut.map((l) => `${l.designation} (${l.reason})`).join('; ')}.
                </p>
              ) : null}
            </div>
          )}
        </QueryView>
      </Panel>
    </div>
  );
}
