import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { meterReplacementInputSchema, modeHoursInputSchema, type LogRow } from '../../../../shared/schemas/logs';
import { Alert } from '../../../components/ui/alert';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { toNumber } from '../../../lib/number-fields';
import { useCreateMeterReplacement } from '../api/create-meter-replacement';
import { usePutModeHours } from '../api/put-mode-hours';

/** Records the meter replacement (or rollover) behind a flagged negative delta. */
export function MeterReplacementForm({ vesselId, row, onDone, onCancel }: { vesselId: string; row: LogRow; onDone: () => void; onCancel: () => void }) {
  const form = useForm<z.input<typeof meterReplacementInputSchema>, unknown, z.output<typeof meterReplacementInputSchema>>({
    resolver: zodResolver(meterReplacementInputSchema),
    defaultValues: { gensetId: row.gensetId, replacedOn: row.logDate, meter: row.flags.some((f) => f.code === 'METER_NEGATIVE_DELTA' && f.field === 'runningHours') ? 'running_hours' : 'kwh', remarks: null },
  });
  const save = useCreateMeterReplacement(vesselId);
  const server = useServerErrors(form.setError, ['meter', 'replacedOn', 'oldFinalReading', 'newStartReading', 'remarks']);
  const e = form.formState.errors;
  return (
    <form noValidate className="grid gap-3 md:grid-cols-4" onSubmit={form.handleSubmit((input) => { server.clear(); save.mutate({ vesselId, input }, { onSuccess: onDone, onError: server.onError }); })}>
      {server.problem ? <div className="md:col-span-4"><Alert tone="error">{server.problem}</Alert></div> : null}
      <Field label="Meter" htmlFor="mr-meter" error={e.meter?.message}>
        <Select id="mr-meter" {...form.register('meter')}>
          <option value="running_hours">Running-hour meter (h)</option>
          <option value="kwh">Energy meter (kWh)</option>
        </Select>
      </Field>
      <Field label="Replaced on" htmlFor="mr-date" error={e.replacedOn?.message}><Input id="mr-date" type="date" {...form.register('replacedOn')} /></Field>
      <Field label="Old meter's final reading" htmlFor="mr-old" error={e.oldFinalReading?.message}><Input id="mr-old" inputMode="decimal" {...form.register('oldFinalReading', { setValueAs: toNumber })} /></Field>
      <Field label="New meter's start reading" htmlFor="mr-new" error={e.newStartReading?.message} hint="0 for a rollover"><Input id="mr-new" inputMode="decimal" {...form.register('newStartReading', { setValueAs: toNumber })} /></Field>
      <div className="md:col-span-4"><FormActions submitLabel="Record replacement" pending={save.isPending} onCancel={onCancel} /></div>
    </form>
  );
}

const MODES = [
  ['seaH', 'Sea passage'],
  ['manoeuvringH', 'Manoeuvring'],
  ['portH', 'Port'],
  ['anchorageH', 'Anchorage'],
  ['shorePowerH', 'Shore power'],
] as const;

/** Hours of one vessel-day in each operating mode (at most 25 h in all, for a clock-change day). */
export function ModeHoursForm({ vesselId, onDone }: { vesselId: string; onDone: () => void }) {
  const form = useForm<z.input<typeof modeHoursInputSchema> & { logDate: string }>({ defaultValues: { logDate: new Date().toISOString().slice(0, 10) } });
  const save = usePutModeHours(vesselId);
  const server = useServerErrors(form.setError, MODES.map((m) => m[0]));
  return (
    <form
      noValidate
      className="grid gap-3 md:grid-cols-6"
      onSubmit={form.handleSubmit(({ logDate, ...values }) => {
        server.clear();
        const parsed = modeHoursInputSchema.safeParse(values);
        if (!parsed.success) {
          for (const issue of parsed.error.issues) form.setError(String(issue.path[0] ?? 'seaH') as 'seaH', { message: issue.message });
          return;
        }
        save.mutate({ vesselId, logDate, input: parsed.data }, { onSuccess: onDone, onError: server.onError });
      })}
    >
      {server.problem ? <div className="md:col-span-6"><Alert tone="error">{server.problem}</Alert></div> : null}
      <Field label="Date" htmlFor="mh-date"><Input id="mh-date" type="date" {...form.register('logDate')} /></Field>
      {MODES.map(([name, label]) => (
        <Field key={name} label={label} htmlFor={`mh-${name}`} error={form.formState.errors[name]?.message}>
          <Input id={`mh-${name}`} inputMode="decimal" unit="h" {...form.register(name, { setValueAs: (v) => (v === '' ? 0 : Number(v)) })} />
        </Field>
      ))}
      <div className="md:col-span-6"><FormActions submitLabel="Save mode hours" pending={save.isPending} onCancel={onDone} /></div>
    </form>
  );
}
