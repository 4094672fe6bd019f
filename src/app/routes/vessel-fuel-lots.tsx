import { Link, useParams } from 'react-router-dom';
import { can } from '../../../shared/roles';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { paths } from '../../config/paths';
import { FuelLotRegister } from '../../features/fuel-lots/components/fuel-lot-register';
import { useSignedIn } from '../signed-in';

export function Component() {
  const { vesselId = '' } = useParams();
  const me = useSignedIn();
  return (
    <>
      <PageHeader
        title="Fuel lot register"
        description="Each bunker delivery: grade, density at 15 °C, LCV (measured, or estimated from density by the ISO 8217 annex formula), sulphur and the delivery note or lab report."
        actions={<Link className="text-small font-semibold underline" to={paths.vesselLogs.href(vesselId)}>Back to the log</Link>}
      />
      <Panel>
        <FuelLotRegister vesselId={vesselId} mayEdit={can(me.role, 'logs:edit')} />
      </Panel>
    </>
  );
}
