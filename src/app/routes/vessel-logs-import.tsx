import { Link, useParams } from 'react-router-dom';
import { can } from '../../../shared/roles';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { paths } from '../../config/paths';
import { ImportHistory } from '../../features/logs/components/import-history';
import { ImportWizard } from '../../features/logs/components/import-wizard';
import { useSignedIn } from '../signed-in';

export function Component() {
  const { vesselId = '' } = useParams();
  const me = useSignedIn();
  const mayEdit = can(me.role, 'logs:edit');
  return (
    <>
      <PageHeader
        title="Import engine-room logs"
        description="Upload the CSV the engine room keeps, confirm the columns once (the mapping is saved for this vessel), see every problem before anything is stored, then import. Rows with errors are never imported."
        actions={<Link className="text-small font-semibold underline" to={paths.vesselLogs.href(vesselId)}>Back to the log</Link>}
      />
      {mayEdit ? (
        <Panel title="Upload">
          <ImportWizard vesselId={vesselId} />
        </Panel>
      ) : null}
      <Panel title="Import history">
        <ImportHistory vesselId={vesselId} mayUndo={mayEdit} />
      </Panel>
    </>
  );
}
