import { useState } from 'react';
import type { HourBudgetPlan } from '../../../../shared/schemas/overhaul';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatDateTime, formatKg } from '../../../lib/format';
import { useApproveHourBudget } from '../api/approve-hour-budget';
import { StaggerView } from './stagger-panel';

const TONE = { proposed: 'accent', approved: 'good', superseded: 'neutral' } as const;

/** Saved hour-budget plans; planners and superintendents approve a proposed one (the earlier approved is superseded). */
export function HourBudgetPlans({ vesselId, plans, canApprove }: { vesselId: string; plans: HourBudgetPlan[]; canApprove: boolean }) {
  const approve = useApproveHourBudget();
  const [open, setOpen] = useState<string | null>(null);
  if (!plans.length) {
    const next = canApprove
      ? 'Propose budgets above and save them.'
      : 'A maintenance planner or technical superintendent proposes and approves hour budgets here.';
    return <EmptyState title="No hour-budget plans yet" next={next} />;
  }
  const shown = plans.find((p) => p.id === open);
  return (
    <div className="space-y-3">
      <Table caption="Hour-budget plans">
        <thead>
          <tr><Th>Until</Th><Th>Gap</Th><Th>Result</Th><Th numeric>Fuel cost</Th><Th>Status</Th><Th>Created</Th><Th /></tr>
        </thead>
        <tbody>
          {plans.map((p) => (
            <tr key={p.id} data-budget-plan={p.status}>
              <Td>{formatDate(p.untilDate)}</Td>
              <Td>{p.result.minGapDays}&nbsp;days</Td>
              <Td>{p.result.status}</Td>
              <Td numeric>{formatKg(p.result.fuelDeltaKg)}</Td>
              <Td>
                <Badge tone={TONE[p.status]}>{p.status}</Badge>
                {p.approvedAt ? <span className="block text-caption text-hull-500">by {p.approvedBy ?? '–'}, {formatDateTime(p.approvedAt)}</span> : null}
              </Td>
              <Td>{formatDateTime(p.createdAt)}{p.createdBy ? ` by ${p.createdBy}` : ''}</Td>
              <Td className="space-x-2 text-right">
                <Button size="sm" variant="secondary" onClick={() => setOpen(open === p.id ? null : p.id)}>{open === p.id ? 'Hide' : 'Show'}</Button>
                {canApprove && p.status === 'proposed' && p.result.status !== 'infeasible' ? (
                  <Button size="sm" pending={approve.isPending && approve.variables?.planId === p.id} onClick={() => approve.mutate({ vesselId, planId: p.id })} data-action="approve-budgets">
                    Approve
                  </Button>
                ) : null}
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      {approve.isError ? <Alert tone="error">{approve.error.message}</Alert> : null}
      {shown ? <StaggerView result={shown.result} /> : null}
    </div>
  );
}
