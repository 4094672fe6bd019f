import type { EChartsOption } from 'echarts';
import type { PlanDetail } from '../../../../shared/schemas/plans';
import { LazyChart } from '../../../components/charts/lazy-chart';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { LoadingState } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatHours, formatKg, formatPct } from '../../../lib/format';

function loadsOption(d: PlanDetail): EChartsOption {
  const r = d.result!;
  return {
    tooltip: { trigger: 'axis', valueFormatter: (v) => `${Math.round(Number(v))} kW` },
    legend: { top: 0 },
    grid: { left: 64, right: 16, top: 36, bottom: 48 },
    xAxis: { type: 'value', name: 'Hours from plan start (h)', nameLocation: 'middle', nameGap: 30 },
    yAxis: { type: 'value', name: 'Set load (kW)' },
    series: d.units.map((u, i) => ({ name: u.designation, type: 'line', step: 'end', stack: 'load', areaStyle: {}, symbol: 'none', data: r.periods.map((p) => [p.startH, p.loadsKw[i]]) })),
  };
}

function hoursOption(d: PlanDetail): EChartsOption {
  const r = d.result!;
  return {
    tooltip: { trigger: 'axis', valueFormatter: (v) => `${Number(v).toFixed(1)} h` },
    legend: { top: 0 },
    grid: { left: 64, right: 16, top: 36, bottom: 40 },
    xAxis: { type: 'category', data: r.units.map((u) => u.designation), name: 'Set' },
    yAxis: { type: 'value', name: 'Running hours (h)' },
    series: [
      { name: 'Planned', type: 'bar', data: r.units.map((u) => u.runningHours) },
      { name: 'Budget', type: 'bar', data: r.units.map((u) => u.budgetH ?? 0) },
    ],
  };
}

/** A plan: progress while solving, else totals, baseline saving, charts and hours to overhaul. */
export function PlanView({ plan, canApprove, onApprove, onResolve, approving }: { plan: PlanDetail; canApprove: boolean; onApprove: () => void; onResolve: () => void; approving: boolean }) {
  if (plan.status === 'queued' || plan.status === 'solving') return <LoadingState label={`Solving… ${Math.round(plan.progress * 100)} %`} />;
  if (plan.status === 'failed') return <Alert tone="error">The solve failed: {plan.error}</Alert>;
  const r = plan.result!;
  if (r.status === 'infeasible') return <Alert tone="error">No plan meets the rules: {r.infeasibleReasons.join('; ') || r.statusText}</Alert>;
  return (
    <div className="space-y-4">
      <Panel
        title={`${plan.name}: ${r.statusText}`}
        actions={
          <div className="flex gap-2">
            <Button variant="secondary" onClick={onResolve}>Re-solve</Button>
            {canApprove && plan.status === 'solved' ? <Button onClick={onApprove} pending={approving}>Approve</Button> : null}
          </div>
        }
      >
        <p className="text-small">
          Fuel {formatKg(r.totalFuelKg)} (starts {formatKg(r.startFuelKg)}), CO2 {formatKg(r.co2Kg)} ({r.fuelGrade}). Baseline ({r.baseline.statusText}): {formatKg(r.baseline.totalFuelKg)}; saving{' '}
          {formatKg(r.savingFuelKg)} ({formatPct(r.savingPct)}), CO2 {formatKg(r.savingCo2Kg)}. {plan.status === 'approved' ? `Approved by ${plan.approvedBy ?? '?'}.` : ''}
        </p>
      </Panel>
      <Panel title="Set loads over time">
        <LazyChart option={loadsOption(plan)} heightPx={320} label="Stacked set loads in kW over the plan's hours" />
      </Panel>
      <Panel title="Hours used against budget">
        <LazyChart option={hoursOption(plan)} heightPx={260} label="Planned running hours and budgets per set in hours" />
        <Table caption="Starts, hours and hours left to overhaul">
          <thead>
            <tr>
              <Th>Set</Th>
              <Th numeric>Starts</Th>
              <Th numeric>Hours</Th>
              <Th numeric>Budget</Th>
              <Th>Hours left at the end</Th>
            </tr>
          </thead>
          <tbody>
            {r.units.map((u) => (
              <tr key={u.gensetId}>
                <Td>{u.designation}</Td>
                <Td numeric>{u.starts}</Td>
                <Td numeric>{formatHours(u.runningHours)}</Td>
                <Td numeric>{formatHours(u.budgetH)}</Td>
                <Td>{u.maintenance.map((m) => `${m.kind}: ${formatHours(m.hoursLeftAtEndH)}`).join(', ') || '–'}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
    </div>
  );
}
