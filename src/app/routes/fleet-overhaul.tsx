import { useState } from 'react';
import { Alert } from '../../components/ui/alert';
import { Field, Select } from '../../components/ui/form-field';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { useFleetOverhaul } from '../../features/overhaul/api/get-fleet-overhaul';
import { FleetDueTable } from '../../features/overhaul/components/fleet-table';

/** When every set of every vessel falls due, soonest first. */
export function Component() {
  const [windowDays, setWindowDays] = useState<30 | 90>(30);
  const fleet = useFleetOverhaul(windowDays);
  return (
    <div className="space-y-4">
      <PageHeader title="Overhauls across the fleet" description="Every maintenance kind of every set by forecast due date at its recent usage." />
      {fleet.data ? <Alert tone="error"><strong>Advice only: </strong>{fleet.data.caution}</Alert> : null}
      <Panel title="Due dates">
        <div className="space-y-4">
          <Field label="Usage window" htmlFor="fo-window" className="max-w-xs">
            <Select id="fo-window" value={String(windowDays)} onChange={(e) => setWindowDays(Number(e.target.value) as 30 | 90)}>
              <option value="30">Last 30 days</option>
              <option value="90">Last 90 days</option>
            </Select>
          </Field>
          <QueryView query={fleet} loadingLabel="Counting hours…" isEmpty={(f) => f.rows.length === 0 && f.problems.length === 0} empty={<EmptyState title="Nothing to plan yet" next="Enter each set's maintenance intervals in the vessel register and log the hour meters." />}>
            {(f) => (
              <div className="space-y-3">
                {f.problems.map((p) => <Alert key={p.gensetId} tone="error">{p.vesselName} {p.designation}: {p.problem}</Alert>)}
                {f.rows.length ? <FleetDueTable rows={f.rows} vesselHref={paths.vesselOverhaul.href} /> : null}
              </div>
            )}
          </QueryView>
        </div>
      </Panel>
    </div>
  );
}
