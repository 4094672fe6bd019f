import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { can } from '../../../shared/roles';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { formatKw } from '../../lib/format';
import { useVessels } from '../../features/vessels/api/get-vessels';
import { FleetOverview } from '../../features/vessels/components/fleet-overview';
import { VesselForm } from '../../features/vessels/components/vessel-form';
import { FleetDriftSummary } from '../../features/curves/components/drift-badge';
import { useSignedIn } from '../signed-in';

export function Component() {
  const me = useSignedIn();
  const vessels = useVessels();
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  const mayCreate = can(me.role, 'vessels:create');

  const totalKw = vessels.data?.reduce((sum, v) => sum + v.installedKw, 0) ?? 0;
  const description = vessels.data?.length
    ? `${vessels.data.length} ${vessels.data.length === 1 ? 'vessel' : 'vessels'}, ${formatKw(totalKw)} installed in gensets`
    : `${me.company.name}`;

  return (
    <>
      <PageHeader
        title={me.vesselIds === null ? 'Fleet overview' : 'Your vessels'}
        description={description}
        actions={
          mayCreate && !adding ? (
            <Button onClick={() => setAdding(true)} data-action="add-vessel">
              Add vessel
            </Button>
          ) : null
        }
      />
      {adding ? (
        <Panel title="New vessel" className="mb-6">
          <VesselForm onCancel={() => setAdding(false)} onDone={(vesselId) => navigate(paths.vessel.href(vesselId))} />
        </Panel>
      ) : null}
      {vessels.data?.length ? (
        <Panel title="SFOC drift since overhaul" className="mb-6">
          <FleetDriftSummary />
        </Panel>
      ) : null}
      <QueryView
        query={vessels}
        loadingLabel="Loading the fleet…"
        isEmpty={(list) => list.length === 0}
        empty={
          mayCreate ? (
            <EmptyState
              title="No vessels yet"
              next="Add the first vessel with its IMO number and bus sections, then enter its gensets on the vessel page."
              action={adding ? undefined : <Button onClick={() => setAdding(true)}>Add the first vessel</Button>}
            />
          ) : (
            <EmptyState
              title="No vessels for you yet"
              next="Your administrator has not added a vessel or has not given you access to one. Ask them to add the vessel or to assign it to you."
            />
          )
        }
      >
        {(list) => <FleetOverview vessels={list} />}
      </QueryView>
    </>
  );
}
