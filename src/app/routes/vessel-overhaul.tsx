import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '../../../shared/roles';
import { LazyChart } from '../../components/charts/lazy-chart';
import { Alert } from '../../components/ui/alert';
import { Field, Input, Select } from '../../components/ui/form-field';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { Table, Td, Th } from '../../components/ui/table';
import { paths } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useHourBudgets } from '../../features/overhaul/api/get-hour-budgets';
import { useMaintenanceEvents } from '../../features/overhaul/api/get-maintenance-events';
import { useVesselOverhaul, type OverhaulUsage } from '../../features/overhaul/api/get-vessel-overhaul';
import { DueTable } from '../../features/overhaul/components/due-table';
import { HourBudgetPlans } from '../../features/overhaul/components/hour-budget-plans';
import { RecordWorkForm } from '../../features/overhaul/components/record-work-form';
import { StaggerPanel } from '../../features/overhaul/components/stagger-panel';
import { timelineOption } from '../../features/overhaul/components/timeline-option';
import { WorkWindows } from '../../features/overhaul/components/work-windows';
import { usePlans } from '../../features/plans/api/get-plans';
import { formatDate, formatHours } from '../../lib/format';

/** Recent usage (30 or 90 days) or a saved voyage plan with its start date. */
function UsagePicker({ vesselId, usage, onChange }: { vesselId: string; usage: OverhaulUsage; onChange: (u: OverhaulUsage) => void }) {
  const plans = usePlans(vesselId);
  const solved = (plans.data ?? []).filter((p) => p.status === 'solved' || p.status === 'approved');
  const value = usage.usage === 'plan' ? 'plan' : String(usage.windowDays);
  return (
    <div className="grid gap-3 md:grid-cols-4">
      <Field label="Forecast with" htmlFor="ov-usage">
        <Select
          id="ov-usage"
          value={value}
          onChange={(e) => {
            const v = e.target.value;
            if (v === 'plan') {
              if (solved[0]) onChange({ usage: 'plan', windowDays: usage.windowDays, planId: solved[0].id });
            } else onChange({ usage: 'recent', windowDays: Number(v) as 30 | 90 });
          }}
        >
          <option value="30">Usage of the last 30 days</option>
          <option value="90">Usage of the last 90 days</option>
          <option value="plan" disabled={!solved.length}>A saved voyage plan{solved.length ? '' : ' (none solved yet)'}</option>
        </Select>
      </Field>
      {usage.usage === 'plan' ? (
        <>
          <Field label="Voyage plan" htmlFor="ov-plan">
            <Select id="ov-plan" value={usage.planId} onChange={(e) => onChange({ ...usage, planId: e.target.value })}>
              {solved.map((p) => <option key={p.id} value={p.id}>{p.name} ({formatHours(p.horizonH)})</option>)}
            </Select>
          </Field>
          <Field label="Plan starts on" htmlFor="ov-start" hint="Empty: the day after the latest readings">
            <Input id="ov-start" type="date" value={usage.planStartDate ?? ''} onChange={(e) => onChange({ ...usage, planStartDate: e.target.value || undefined })} />
          </Field>
          <Field label="After the plan" htmlFor="ov-after">
            <Select id="ov-after" value={String(usage.windowDays)} onChange={(e) => onChange({ ...usage, windowDays: Number(e.target.value) as 30 | 90 })}>
              <option value="30">30-day usage</option>
              <option value="90">90-day usage</option>
            </Select>
          </Field>
        </>
      ) : null}
    </div>
  );
}

function CompletedWork({ vesselId }: { vesselId: string }) {
  const events = useMaintenanceEvents(vesselId);
  return (
    <QueryView query={events} isEmpty={(l) => l.length === 0} empty={<EmptyState title="No completed work recorded" next="Counts start from the register's last overhaul until work is recorded." />}>
      {(list) => (
        <Table caption="Completed work">
          <thead><tr><Th>Done on</Th><Th>Set</Th><Th>Work</Th><Th numeric>Hour meter</Th><Th>Remarks</Th><Th>Recorded by</Th></tr></thead>
          <tbody>
            {list.map((e) => (
              <tr key={e.id}>
                <Td>{formatDate(e.doneOn)}</Td><Td>{e.designation}</Td><Td>{e.kind}</Td><Td numeric>{formatHours(e.runningHours)}</Td><Td>{e.remarks ?? ''}</Td><Td>{e.recordedBy ?? '–'}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </QueryView>
  );
}

/** Running hours and overhaul planner of one vessel. */
export function Component() {
  const { vesselId = '' } = useParams();
  const me = useMe();
  const [usage, setUsage] = useState<OverhaulUsage>({ usage: 'recent', windowDays: 30 });
  const overhaul = useVesselOverhaul(vesselId, usage);
  const budgets = useHourBudgets(vesselId);
  const role = me.data?.role;
  const mayPlan = !!role && can(role, 'overhaul:plan');
  const mayRecord = !!role && can(role, 'overhaul:record');
  return (
    <div className="space-y-4">
      <PageHeader
        title={overhaul.data ? `${overhaul.data.vesselName}: running hours and overhauls` : 'Running hours and overhauls'}
        description="Hours since each maintenance, when it falls due, the work windows, and hour budgets that spread the work."
        actions={<Link to={paths.fleetOverhaul.href()} className="text-small font-semibold underline">All sets of the fleet</Link>}
      />
      {overhaul.data ? <Alert tone="error"><strong>Advice only: </strong>{overhaul.data.caution}</Alert> : null}
      <Panel title="Due dates">
        <div className="space-y-4">
          <UsagePicker vesselId={vesselId} usage={usage} onChange={setUsage} />
          <QueryView query={overhaul} loadingLabel="Counting hours…" isEmpty={(o) => o.sets.length === 0} empty={<EmptyState title="No gensets on this vessel" next="Add the sets in the vessel register first." />}>
            {(o) => {
              const withItems = o.sets.filter((s) => s.items.length > 0);
              return (
                <div className="space-y-4">
                  {o.sets.filter((s) => s.problem).map((s) => <Alert key={s.gensetId} tone="error">{s.designation}: {s.problem}</Alert>)}
                  {withItems.length === 0 ? (
                    <EmptyState title="No maintenance intervals entered" next="Enter each set's maintenance kinds and the maker's intervals in the vessel register." />
                  ) : (
                    <>
                      <LazyChart option={timelineOption(withItems, o.windows)} heightPx={80 + 46 * withItems.length} label={`Forecast due dates of ${withItems.length} sets with ${o.windows.length} work windows shaded`} />
                      <DueTable sets={withItems} windows={o.windows} />
                      {o.sets.some((s) => s.items.length === 0) ? (
                        <p className="text-small text-hull-600" data-note="sets-without-intervals">
                          No maintenance intervals entered for {o.sets.filter((s) => s.items.length === 0).map((s) => s.designation).join(', ')}: enter them in the vessel register to see their due dates.
                        </p>
                      ) : null}
                      {o.planName ? <p className="text-caption text-hull-500">Under voyage plan “{o.planName}” from {formatDate(o.planStartDate)}; after it ends, the recent usage.</p> : null}
                    </>
                  )}
                </div>
              );
            }}
          </QueryView>
        </div>
      </Panel>
      <Panel title="Work windows (port calls, dry docks)">
        <QueryView query={overhaul}>{(o) => <WorkWindows vesselId={vesselId} windows={o.windows} canEdit={mayPlan} />}</QueryView>
      </Panel>
      <Panel title="Completed work">
        <div className="space-y-4">
          {mayRecord ? (
            <QueryView query={overhaul}>
              {(o) => (
                <RecordWorkForm vesselId={vesselId} sets={o.sets.map((s) => ({ gensetId: s.gensetId, designation: s.designation, kinds: s.items.map((i) => i.kind) }))} onDone={() => undefined} />
              )}
            </QueryView>
          ) : null}
          <CompletedWork vesselId={vesselId} />
        </div>
      </Panel>
      {mayPlan ? (
        <Panel title="Stagger advice: hour budgets per set">
          <StaggerPanel vesselId={vesselId} />
        </Panel>
      ) : null}
      <Panel title="Hour-budget plans">
        <div className="space-y-2">
          <p className="text-small text-hull-600">The approved plan is what voyage plans of this vessel keep to as running-hour limits.</p>
          <QueryView query={budgets}>{(list) => <HourBudgetPlans vesselId={vesselId} plans={list} canApprove={mayPlan} />}</QueryView>
        </div>
      </Panel>
      <p className="text-small text-hull-600">E-mail alerts when a set comes within a chosen number of running hours of a due: subscribe to “Overhaul-due alerts” in your e-mail subscriptions.</p>
    </div>
  );
}
