import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { logEntryInputSchema, type LogEntryInput, type LogRow } from '../../../../shared/schemas/logs';
import { Alert } from '../../../components/ui/alert';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { toNumberOrNull } from '../../../lib/number-fields';
import { useSaveLog } from '../api/save-log';

const NUMBERS = [
  ['runningHoursMeter', 'Running-hour meter reading', 'h'],
  ['hoursRun', 'Hours run (when no meter reading)', 'h'],
  ['kwhMeter', 'Energy meter reading', 'kWh'],
  ['kwh', 'Energy produced (when no meter reading)', 'kWh'],
  ['fuelMassKg', 'Fuel mass (mass flowmeter)', 'kg'],
  ['fuelVolumeL', 'Fuel volume (volumetric meter or sounding)', 'L'],
  ['fuelTempC', 'Fuel temperature at the meter', '°C'],
] as const;
const FIELD_NAMES = ['gensetId', 'logDate', 'fuelLotId', 'remarks', ...NUMBERS.map((n) => n[0])];

/** Manual entry or edit of one set's day (raw values in h, kWh, kg, L, °C). */
export function LogEntryForm({ vesselId, sets, lots, row, onDone, onCancel }: {
  vesselId: string;
  sets: { id: string; designation: string }[];
  lots: { id: string; reference: string; grade: string }[];
  row?: LogRow;
  onDone: () => void;
  onCancel: () => void;
}) {
  const form = useForm<z.input<typeof logEntryInputSchema>, unknown, z.output<typeof logEntryInputSchema>>({
    resolver: zodResolver(logEntryInputSchema),
    defaultValues: row
      ? { gensetId: row.gensetId, logDate: row.logDate, runningHoursMeter: row.runningHoursMeter, hoursRun: row.hoursRun, kwhMeter: row.kwhMeter, kwh: row.kwh, fuelMassKg: row.fuelMassKg, fuelVolumeL: row.fuelVolumeL, fuelTempC: row.fuelTempC, fuelLotId: row.fuelLotId, remarks: row.remarks }
      : { gensetId: sets[0]?.id, logDate: new Date().toISOString().slice(0, 10), fuelLotId: null, remarks: null },
  });
  const save = useSaveLog(vesselId);
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const errors = form.formState.errors;
  const submit = form.handleSubmit((input: LogEntryInput) => {
    server.clear();
    save.mutate({ vesselId, logId: row?.id, input }, { onSuccess: onDone, onError: server.onError });
  });
  return (
    <form onSubmit={submit} className="grid gap-3 md:grid-cols-3" noValidate>
      {server.problem ? <div className="md:col-span-3"><Alert tone="error">{server.problem}</Alert></div> : null}
      <Field label="Set" htmlFor="le-set" error={errors.gensetId?.message}>
        <Select id="le-set" {...form.register('gensetId')}>
          {sets.map((s) => (
            <option key={s.id} value={s.id}>{s.designation}</option>
          ))}
        </Select>
      </Field>
      <Field label="Date" htmlFor="le-date" error={errors.logDate?.message}>
        <Input id="le-date" type="date" {...form.register('logDate')} />
      </Field>
      <Field label="Fuel lot" htmlFor="le-lot" error={errors.fuelLotId?.message} hint="Empty: the latest lot delivered before the day is assumed (flagged)">
        <Select id="le-lot" {...form.register('fuelLotId', { setValueAs: (v) => (v === '' ? null : v) })}>
          <option value="">Not given</option>
          {lots.map((l) => (
            <option key={l.id} value={l.id}>{l.reference} ({l.grade})</option>
          ))}
        </Select>
      </Field>
      {NUMBERS.map(([name, label, unit]) => (
        <Field key={name} label={label} htmlFor={`le-${name}`} error={errors[name]?.message}>
          <Input id={`le-${name}`} inputMode="decimal" unit={unit} invalid={!!errors[name]} {...form.register(name, { setValueAs: toNumberOrNull })} />
        </Field>
      ))}
      <Field label="Remarks" htmlFor="le-remarks" error={errors.remarks?.message} className="md:col-span-2">
        <Input id="le-remarks" {...form.register('remarks', { setValueAs: (v) => (v === '' ? null : v) })} />
      </Field>
      <div className="md:col-span-3">
        <FormActions submitLabel={row ? 'Save day' : 'Add day'} pending={save.isPending} onCancel={onCancel} />
      </div>
    </form>
  );
}
