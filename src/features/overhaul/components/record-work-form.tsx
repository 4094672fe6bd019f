import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { maintenanceEventInputSchema } from '../../../../shared/schemas/overhaul';
import { Alert } from '../../../components/ui/alert';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { toNumber } from '../../../lib/number-fields';
import { useRecordMaintenanceEvent } from '../api/record-maintenance-event';

const FIELDS = ['gensetId', 'kind', 'doneOn', 'runningHours', 'remarks'] as const;

/**
 * Records completed work: the date and the reading of the hour meter fitted then. It resets that kind's interval;
 * an overhaul also starts a new post-overhaul curve window.
 */
export function RecordWorkForm({ vesselId, sets, onDone }: { vesselId: string; sets: { gensetId: string; designation: string; kinds: string[] }[]; onDone: () => void }) {
  const record = useRecordMaintenanceEvent();
  const form = useForm<z.input<typeof maintenanceEventInputSchema>, unknown, z.output<typeof maintenanceEventInputSchema>>({
    resolver: zodResolver(maintenanceEventInputSchema),
    defaultValues: { gensetId: sets[0]?.gensetId ?? '', kind: sets[0]?.kinds[0] ?? 'top overhaul', doneOn: '', remarks: null },
  });
  const server = useServerErrors(form.setError, FIELDS);
  const e = form.formState.errors;
  const chosen = sets.find((s) => s.gensetId === form.watch('gensetId'));
  return (
    <form
      noValidate
      data-form="record-work"
      className="grid gap-3 md:grid-cols-5"
      onSubmit={form.handleSubmit((input) => {
        server.clear();
        record.mutate({ vesselId, input }, { onSuccess: () => { form.reset({ ...input, doneOn: '', runningHours: undefined as unknown as number, remarks: null }); onDone(); }, onError: server.onError });
      })}
    >
      {server.problem ? <div className="md:col-span-5"><Alert tone="error">{server.problem}</Alert></div> : null}
      {record.isSuccess ? <div className="md:col-span-5"><Alert tone="success">Recorded. The interval counts from this work now.</Alert></div> : null}
      <Field label="Set" htmlFor="rw-set" error={e.gensetId?.message}>
        <Select id="rw-set" {...form.register('gensetId')}>{sets.map((s) => <option key={s.gensetId} value={s.gensetId}>{s.designation}</option>)}</Select>
      </Field>
      <Field label="Work done" htmlFor="rw-kind" error={e.kind?.message} hint="A kind from the set's register resets its interval">
        <Input id="rw-kind" list="rw-kinds" {...form.register('kind')} />
        <datalist id="rw-kinds">{(chosen?.kinds ?? []).map((k) => <option key={k} value={k} />)}</datalist>
      </Field>
      <Field label="Done on" htmlFor="rw-date" error={e.doneOn?.message}><Input id="rw-date" type="date" {...form.register('doneOn')} /></Field>
      <Field label="Hour meter then" htmlFor="rw-hours" error={e.runningHours?.message} hint="The meter fitted on that day">
        <Input id="rw-hours" inputMode="decimal" unit="h" {...form.register('runningHours', { setValueAs: toNumber })} />
      </Field>
      <Field label="Remarks" htmlFor="rw-remarks" error={e.remarks?.message}><Input id="rw-remarks" {...form.register('remarks', { setValueAs: (v) => (v ? String(v) : null) })} /></Field>
      <div className="md:col-span-5"><FormActions submitLabel="Record completed work" pending={record.isPending} onCancel={() => form.reset()} size="sm" /></div>
    </form>
  );
}
