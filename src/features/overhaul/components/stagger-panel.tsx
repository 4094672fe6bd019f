import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper } from '@tanstack/react-table';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { staggerInputSchema, type StaggerResult } from '../../../../shared/schemas/overhaul';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { formatDate, formatHours, formatKg } from '../../../lib/format';
import { toNumber, toNumberOrNull } from '../../../lib/number-fields';
import { usePreviewStagger } from '../api/preview-stagger';
import { useSaveHourBudget } from '../api/save-hour-budget';
import { DataTable, type OverhaulTableFeatures } from './data-table';

const FIELDS = ['untilDate', 'minGapDays', 'windowDays', 'requiredSetHoursPerDay', 'maxHPerDay', 'allowDueAfterDate'] as const;
type Budget = StaggerResult['budgets'][number];
const col = createColumnHelper<OverhaulTableFeatures, Budget>();
const rate = (v: number) => `${v.toFixed(2)}\u00a0h/day`;

const STATUS: Record<StaggerResult['status'], { tone: 'good' | 'accent' | 'bad'; text: string }> = {
  'in-windows': { tone: 'good', text: 'every due in a window, gap kept' },
  nearest: { tone: 'accent', text: 'windows cannot all be met: dues as near them as possible' },
  infeasible: { tone: 'bad', text: 'no budgets meet the request' },
};

function money(v: number | null, currency: string): string {
  if (v === null) return '–';
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 0 }).format(v);
}

/** The proposal: budgets per set, due dates and windows, the fuel cost of the choice, reasons when not met. */
export function StaggerView({ result }: { result: StaggerResult }) {
  const columns = col.columns([
    col.accessor('designation', { header: 'Set' }),
    col.accessor('kind', { header: 'Falls due', cell: (c) => c.getValue() ?? '–' }),
    col.accessor('hoursLeftH', { header: 'Hours left now', cell: (c) => formatHours(c.getValue()) }),
    col.accessor('budgetH', { header: 'Hour budget', cell: (c) => formatHours(c.getValue()) }),
    col.accessor('hPerDay', { header: 'Rate', cell: (c) => rate(c.getValue()) }),
    col.accessor('baselineBudgetH', { header: 'At present usage', cell: (c) => formatHours(c.getValue()) }),
    col.accessor('dueDate', { header: 'Predicted due', cell: (c) => (c.getValue() ? formatDate(c.getValue()) : 'after the date') }),
    col.display({
      id: 'window',
      header: 'Window',
      cell: (c) => {
        const b = c.row.original;
        if (b.windowId) return b.windowLabel;
        if (b.daysFromWindow !== null) return <span className="text-signal-700">{b.daysFromWindow} days from {b.windowLabel?.replace(/^near /, '')}</span>;
        return '–';
      },
    }),
    col.accessor('fuelKg', { header: 'Fuel', cell: (c) => formatKg(c.getValue()) }),
  ]);
  const s = STATUS[result.status];
  return (
    <div className="space-y-3" data-stagger-status={result.status}>
      <p className="text-small">
        <Badge tone={s.tone}>{result.status}</Badge> {s.text}. From {formatDate(result.fromDate)} (latest readings) to {formatDate(result.untilDate)}: {result.horizonDays} days,
        gap {result.minGapDays} days, plant needs {result.requiredSetHoursPerDay.toFixed(1)} set-hours per day.
      </p>
      {result.reasons.length ? (
        <Alert tone={result.status === 'infeasible' ? 'error' : 'info'}>
          <ul className="list-disc pl-4">{result.reasons.map((r) => <li key={r}>{r}</li>)}</ul>
        </Alert>
      ) : null}
      {result.budgets.length ? <DataTable caption="Proposed hour budgets" data={result.budgets} columns={columns} numeric={['hoursLeftH', 'budgetH', 'hPerDay', 'baselineBudgetH', 'fuelKg']} /> : null}
      {result.budgets.length ? (
        <p className="text-small" data-fuel-delta={result.fuelDeltaKg}>
          Fuel cost of this choice against the present usage: <strong className="figures">{formatKg(result.fuelDeltaKg)}</strong> ({formatKg(result.fuelKg)} against {formatKg(result.baselineFuelKg)})
          {result.costDelta !== null
            ? `, ${money(result.costDelta, result.currency)} at ${money(result.pricePerT, result.currency)}/t ${result.fuelGrade ?? ''}`
            : `; no company fuel price for ${result.fuelGrade ?? 'the main grade'}, so no money figure`}
          . Fuel per running hour is each set's logged figure of its last 90 days (shop-test SFOC at 75 % load without logs).
        </p>
      ) : null}
      {result.leftOut.length ? <p className="text-caption text-hull-500">Left out: {result.leftOut.map((l) => `${l.designation} (${l.reason})`).join('; ')}</p> : null}
    </div>
  );
}

/** Choose a date and a gap, see the proposal, save it as a proposed hour-budget plan. */
export function StaggerPanel({ vesselId }: { vesselId: string }) {
  const preview = usePreviewStagger();
  const save = useSaveHourBudget();
  const form = useForm<z.input<typeof staggerInputSchema>, unknown, z.output<typeof staggerInputSchema>>({
    resolver: zodResolver(staggerInputSchema),
    defaultValues: { untilDate: '', minGapDays: 14, windowDays: 30, requiredSetHoursPerDay: null, maxHPerDay: 24, allowDueAfterDate: false },
  });
  const server = useServerErrors(form.setError, FIELDS);
  const e = form.formState.errors;
  const submit = (input: z.output<typeof staggerInputSchema>) => {
    server.clear();
    save.reset();
    preview.mutate({ vesselId, input }, { onError: server.onError });
  };
  return (
    <div className="space-y-4">
      <form noValidate data-form="stagger" className="grid gap-3 md:grid-cols-6" onSubmit={form.handleSubmit(submit)}>
        {server.problem ? <div className="md:col-span-6"><Alert tone="error">{server.problem}</Alert></div> : null}
        <Field label="Budgets until" htmlFor="st-until" error={e.untilDate?.message}><Input id="st-until" type="date" {...form.register('untilDate')} /></Field>
        <Field label="Least gap between dues" htmlFor="st-gap" error={e.minGapDays?.message}><Input id="st-gap" inputMode="numeric" unit="days" {...form.register('minGapDays', { setValueAs: toNumber })} /></Field>
        <Field label="Usage window" htmlFor="st-window" error={e.windowDays?.message}>
          <Select id="st-window" {...form.register('windowDays', { setValueAs: toNumber })}><option value={30}>30 days</option><option value={90}>90 days</option></Select>
        </Field>
        <Field label="Plant needs" htmlFor="st-need" error={e.requiredSetHoursPerDay?.message} hint="Empty: the sets' recent usage added up">
          <Input id="st-need" inputMode="decimal" unit="set-h/day" {...form.register('requiredSetHoursPerDay', { setValueAs: toNumberOrNull })} />
        </Field>
        <Field label="Most per set" htmlFor="st-max" error={e.maxHPerDay?.message}><Input id="st-max" inputMode="decimal" unit="h/day" {...form.register('maxHPerDay', { setValueAs: toNumber })} /></Field>
        <label className="flex items-end gap-2 text-small"><input type="checkbox" {...form.register('allowDueAfterDate')} /> Sets may stay short of their due until the date</label>
        <div className="md:col-span-6 flex gap-2">
          <Button type="submit" pending={preview.isPending} data-action="propose">Propose budgets</Button>
          {preview.data && preview.data.status !== 'infeasible' ? (
            <Button
              variant="secondary"
              pending={save.isPending}
              data-action="save-budgets"
              onClick={form.handleSubmit((input) => save.mutate({ vesselId, input }, { onError: server.onError }))}
            >
              Save as proposed plan
            </Button>
          ) : null}
        </div>
      </form>
      {save.isSuccess ? <Alert tone="success">Saved as a proposed plan. Approve it below to make it the voyage plans' running-hour limits.</Alert> : null}
      {preview.data ? <StaggerView result={preview.data} /> : null}
    </div>
  );
}
