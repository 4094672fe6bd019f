import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '../../../shared/roles';
import type { LogRow } from '../../../shared/schemas/logs';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { errorMessage } from '../../lib/api-client';
import { useFuelLots } from '../../features/fuel-lots/api/get-fuel-lots';
import { useDeleteLog } from '../../features/logs/api/delete-log';
import { useSetExclusion } from '../../features/logs/api/set-exclusion';
import { LogEntryForm } from '../../features/logs/components/log-entry-form';
import { LogTable } from '../../features/logs/components/log-table';
import { MeterReplacementForm, ModeHoursForm } from '../../features/logs/components/small-forms';
import { useVessel } from '../../features/vessels/api/get-vessel';
import { useSignedIn } from '../signed-in';

type Editing = { kind: 'none' } | { kind: 'new' } | { kind: 'edit'; row: LogRow } | { kind: 'meter'; row: LogRow } | { kind: 'modes' };

export function Component() {
  const { vesselId = '' } = useParams();
  const me = useSignedIn();
  const vessel = useVessel(vesselId);
  const lots = useFuelLots(vesselId);
  const remove = useDeleteLog(vesselId);
  const exclusion = useSetExclusion(vesselId);
  const [editing, setEditing] = useState<Editing>({ kind: 'none' });
  const mayEdit = can(me.role, 'logs:edit');
  if (vessel.isPending) return <LoadingState />;
  if (vessel.isError) return <ErrorState error={vessel.error} onRetry={() => void vessel.refetch()} />;
  const v = vessel.data;
  const sets = v.gensets.map((g) => ({ id: g.id, designation: g.designation }));
  const close = () => setEditing({ kind: 'none' });
  const toggleExclusion = (row: LogRow) => {
    if (row.excludedFromFit) return exclusion.mutate({ vesselId, logId: row.id, input: { excluded: false } });
    const reason = window.prompt(`Why leave ${row.designation} ${row.logDate} out of curve fitting?`);
    if (reason) exclusion.mutate({ vesselId, logId: row.id, input: { excluded: true, reason } });
  };
  return (
    <>
      <PageHeader
        title={`Engine-room log · ${v.name}`}
        description="Raw daily readings with hours, energy, load, fuel at 15 °C (Table 54B), fuel referred to the ISO 3046-1 LCV of 42 700 kJ/kg, SFOC and CO₂ (MEPC.364(79) Cf), derived on every read."
        actions={
          <>
            <Link className="text-small font-semibold underline" to={paths.vessel.href(vesselId)}>Vessel</Link>
            <Link className="text-small font-semibold underline" to={paths.vesselLogImport.href(vesselId)}>Import CSV and history</Link>
            <Link className="text-small font-semibold underline" to={paths.vesselFuelLots.href(vesselId)}>Fuel lots</Link>
            {mayEdit ? <Button onClick={() => setEditing({ kind: 'new' })}>Enter a day</Button> : null}
            {mayEdit ? <Button variant="secondary" onClick={() => setEditing({ kind: 'modes' })}>Mode hours</Button> : null}
          </>
        }
      />
      {remove.error || exclusion.error ? <Alert tone="error">{errorMessage(remove.error ?? exclusion.error)}</Alert> : null}
      {editing.kind === 'new' || editing.kind === 'edit' ? (
        <Panel title={editing.kind === 'new' ? 'New day' : `Edit ${editing.row.designation} ${editing.row.logDate}`}>
          <LogEntryForm vesselId={vesselId} sets={sets} lots={lots.data ?? []} row={editing.kind === 'edit' ? editing.row : undefined} onDone={close} onCancel={close} />
        </Panel>
      ) : null}
      {editing.kind === 'meter' ? (
        <Panel title={`Meter replacement of ${editing.row.designation}`}>
          <MeterReplacementForm vesselId={vesselId} row={editing.row} onDone={close} onCancel={close} />
        </Panel>
      ) : null}
      {editing.kind === 'modes' ? (
        <Panel title="Operating-mode hours of a day">
          <ModeHoursForm vesselId={vesselId} onDone={close} />
        </Panel>
      ) : null}
      <Panel>
        {sets.length === 0 ? (
          <p className="text-small">This vessel has no gensets in its register yet; add them on the vessel page first.</p>
        ) : (
          <LogTable
            vesselId={vesselId}
            sets={sets}
            mayEdit={mayEdit}
            onEdit={(row) => setEditing({ kind: 'edit', row })}
            onExclude={toggleExclusion}
            onDelete={(row) => window.confirm(`Delete the log of ${row.designation} on ${row.logDate}?`) && remove.mutate({ vesselId, logId: row.id })}
            onRecordReplacement={(row) => setEditing({ kind: 'meter', row })}
          />
        )}
      </Panel>
    </>
  );
}
