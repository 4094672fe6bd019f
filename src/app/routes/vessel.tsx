import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { LIMITS } from '../../../shared/limits';
import { can } from '../../../shared/roles';
import type { Genset, VesselDetail } from '../../../shared/schemas/vessels';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { errorMessage, isApiError } from '../../lib/api-client';
import { formatDate, formatKw } from '../../lib/format';
import { useDeleteGenset } from '../../features/vessels/api/delete-genset';
import { useDeleteVessel } from '../../features/vessels/api/delete-vessel';
import { useVessel } from '../../features/vessels/api/get-vessel';
import { BusSectionForm } from '../../features/vessels/components/bus-section-form';
import { GensetForm } from '../../features/vessels/components/genset-form';
import { GensetTable } from '../../features/vessels/components/genset-table';
import { VesselForm } from '../../features/vessels/components/vessel-form';
import { VesselDriftBadge } from '../../features/curves/components/drift-badge';
import { useSignedIn } from '../signed-in';

type Editing = { kind: 'none' } | { kind: 'vessel' } | { kind: 'new-set' } | { kind: 'set'; genset: Genset };

function VesselPage({ vessel }: { vessel: VesselDetail }) {
  const me = useSignedIn();
  const navigate = useNavigate();
  const [editing, setEditing] = useState<Editing>({ kind: 'none' });
  const removeSet = useDeleteGenset();
  const removeVessel = useDeleteVessel();
  const mayEditPlant = can(me.role, 'plant:edit');
  const mayEditVessel = can(me.role, 'vessels:edit');
  const mayDeleteVessel = can(me.role, 'vessels:delete');
  const full = vessel.gensets.length >= LIMITS.maxGensetsPerVessel;
  const close = () => setEditing({ kind: 'none' });

  const confirmRemoveSet = (g: Genset) => {
    if (window.confirm(`Remove ${g.designation} from the register of ${vessel.name}?`)) {
      removeSet.mutate({ vesselId: vessel.id, gensetId: g.id });
    }
  };
  const confirmRemoveVessel = () => {
    if (window.confirm(`Delete ${vessel.name} and its genset register? This cannot be undone.`)) {
      removeVessel.mutate(vessel.id, { onSuccess: () => navigate(paths.fleet.href(), { replace: true }) });
    }
  };

  return (
    <>
      <PageHeader
        title={vessel.name}
        description={`IMO ${vessel.imoNumber} · ${vessel.vesselType} · ${vessel.fuelGrades.join(', ')} · ${formatKw(vessel.installedKw)} in ${vessel.gensetCount} ${vessel.gensetCount === 1 ? 'set' : 'sets'} · last log ${vessel.lastLogDate ? formatDate(vessel.lastLogDate) : 'none yet'}`}
        actions={
          <>
            <VesselDriftBadge vesselId={vessel.id} />
            <Link to={paths.vesselLogs.href(vessel.id)} className="text-small font-semibold underline" data-action="open-logs">Engine-room log</Link>
            <Link to={paths.vesselCurves.href(vessel.id)} className="text-small font-semibold underline" data-action="open-curves">
              Fuel curves
            </Link>
            <Link to={paths.vesselRecommend.href(vessel.id)} className="text-small font-semibold underline" data-action="open-recommend">
              Recommend sets
            </Link>
            <Link to={paths.vesselGuideline.href(vessel.id)} className="text-small font-semibold underline" data-action="open-guideline">
              Guideline
            </Link>
            <Link to={paths.vesselPlans.href(vessel.id)} className="text-small font-semibold underline" data-action="open-plans">
              Voyage plans
            </Link>
            <Link to={paths.vesselRules.href(vessel.id)} className="text-small font-semibold underline" data-action="open-rules">
              Operating rules
            </Link>
            <Link to={paths.vesselSavings.href(vessel.id)} className="text-small font-semibold underline" data-action="open-savings">
              Savings
            </Link>
            <Link to={paths.vesselReport.href(vessel.id)} className="text-small font-semibold underline" data-action="open-report">
              Monthly report
            </Link>
            <Link to={paths.vesselOverhaul.href(vessel.id)} className="text-small font-semibold underline" data-action="open-overhaul">Running hours and overhauls</Link>
            {mayEditVessel && editing.kind !== 'vessel' ? (
              <Button variant="secondary" onClick={() => setEditing({ kind: 'vessel' })}>
                Edit vessel
              </Button>
            ) : null}
            {mayDeleteVessel ? (
              <Button variant="danger" onClick={confirmRemoveVessel} pending={removeVessel.isPending} pendingLabel="Deleting…">
                Delete vessel
              </Button>
            ) : null}
          </>
        }
      />
      {removeVessel.isError ? <Alert tone="error">{errorMessage(removeVessel.error)}</Alert> : null}
      {editing.kind === 'vessel' ? (
        <Panel title="Vessel particulars" className="mb-6">
          <VesselForm vessel={vessel} onDone={close} onCancel={close} />
        </Panel>
      ) : null}

      <Panel
        title="Genset register"
        className="mb-6"
        actions={
          mayEditPlant && editing.kind !== 'new-set' ? (
            <Button onClick={() => setEditing({ kind: 'new-set' })} disabled={full} title={full ? `At most ${LIMITS.maxGensetsPerVessel} sets per vessel` : undefined} data-action="add-set">
              Add set
            </Button>
          ) : null
        }
      >
        {editing.kind === 'new-set' || editing.kind === 'set' ? (
          <div className="mb-6 rounded-plate border border-brass-200 bg-brass-50 p-4">
            <h2 className="mb-4 text-lead">{editing.kind === 'set' ? `Edit ${editing.genset.designation}` : 'New set'}</h2>
            <GensetForm
              key={editing.kind === 'set' ? editing.genset.id : 'new'}
              vesselId={vessel.id}
              busSections={vessel.busSections}
              genset={editing.kind === 'set' ? editing.genset : undefined}
              onDone={close}
              onCancel={close}
            />
          </div>
        ) : null}
        {removeSet.isError ? <Alert tone="error">{errorMessage(removeSet.error)}</Alert> : null}
        {vessel.gensets.length === 0 ? (
          <EmptyState
            title="No sets in the register"
            next={
              mayEditPlant
                ? 'Add each diesel generator set with its rating, load limits and shop-test SFOC from the maker’s test record.'
                : 'The chief engineer or the superintendent enters the sets; ask them to complete the register.'
            }
            action={mayEditPlant && editing.kind === 'none' ? <Button onClick={() => setEditing({ kind: 'new-set' })}>Add the first set</Button> : undefined}
          />
        ) : (
          <GensetTable
            vessel={vessel}
            canEdit={mayEditPlant}
            onEdit={(genset) => setEditing({ kind: 'set', genset })}
            onRemove={confirmRemoveSet}
            removingId={removeSet.isPending ? removeSet.variables?.gensetId : undefined}
          />
        )}
      </Panel>

      <Panel title="Bus sections">
        <ul className="mb-4 flex flex-wrap gap-2">
          {vessel.busSections.map((s) => (
            <li key={s.id} className="rounded-plate bg-hull-50 px-3 py-1 text-small font-semibold text-hull-800">
              {s.name}{' '}
              <span className="font-normal text-hull-500">
                ({vessel.gensets.filter((g) => g.busSectionId === s.id).length} sets)
              </span>
            </li>
          ))}
        </ul>
        {mayEditPlant ? <BusSectionForm vesselId={vessel.id} /> : null}
      </Panel>
    </>
  );
}

export function Component() {
  const { vesselId = '' } = useParams();
  const vessel = useVessel(vesselId);

  if (vessel.isPending) return <LoadingState label="Loading the vessel…" />;
  if (vessel.isError) {
    if (isApiError(vessel.error, 404) || isApiError(vessel.error, 403)) {
      return (
        <>
          <PageHeader title="Vessel not found" />
          <EmptyState
            title="This vessel is not in your fleet"
            next={
              <>
                It may have been deleted, or your membership does not cover it. <Link to={paths.fleet.href()} className="underline">Open the fleet overview</Link> to pick
                another vessel.
              </>
            }
          />
        </>
      );
    }
    return (
      <>
        <PageHeader title="Vessel" />
        <ErrorState error={vessel.error} onRetry={() => void vessel.refetch()} />
      </>
    );
  }
  return <VesselPage vessel={vessel.data} />;
}
