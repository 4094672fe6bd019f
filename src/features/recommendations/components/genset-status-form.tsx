import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { gensetStatusInputSchema, type GensetStatusInput, type PlantUnit } from '../../../../shared/schemas/recommendations';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { formatKw } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { useSetGensetStatus } from '../api/set-genset-status';

const FIELD_NAMES = ['available', 'unavailableReason', 'mustRun'] as const;
type StatusChoice = 'available' | 'unavailable' | 'must_run';

const choiceOf = (s: { available: boolean; mustRun: boolean }): StatusChoice => (!s.available ? 'unavailable' : s.mustRun ? 'must_run' : 'available');

/** Label and badge tone of a set's status, for read-only views. */
export function statusLabel(u: Pick<PlantUnit, 'available' | 'mustRun' | 'unavailableReason'>): { text: string; tone: 'good' | 'bad' | 'accent' } {
  if (!u.available) return { text: `unavailable${u.unavailableReason ? `: ${u.unavailableReason}` : ''}`, tone: 'bad' };
  return u.mustRun ? { text: 'must run', tone: 'accent' } : { text: 'available', tone: 'good' };
}

/** One set's status for recommendations: available, unavailable (with the reason) or must run. */
export function GensetStatusForm({ vesselId, unit, canEdit }: { vesselId: string; unit: PlantUnit; canEdit: boolean }) {
  const save = useSetGensetStatus();
  const [saved, setSaved] = useState(false);
  const form = useForm<GensetStatusInput, unknown, z.output<typeof gensetStatusInputSchema>>({
    resolver: zodResolver(gensetStatusInputSchema),
    values: { available: unit.available, unavailableReason: unit.unavailableReason, mustRun: unit.mustRun },
  });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const e = form.formState.errors;
  const choice = choiceOf({ available: form.watch('available'), mustRun: form.watch('mustRun') });
  const id = (name: string) => `status-${unit.gensetId}-${name}`;
  const choose = (next: StatusChoice) => {
    form.setValue('available', next !== 'unavailable', { shouldDirty: true });
    form.setValue('mustRun', next === 'must_run', { shouldDirty: true });
    if (next !== 'unavailable') form.setValue('unavailableReason', null, { shouldDirty: true });
    setSaved(false);
  };
  const submit = form.handleSubmit((status) => {
    server.clear();
    save.mutate({ vesselId, gensetId: unit.gensetId, status }, { onSuccess: () => setSaved(true), onError: server.onError });
  });
  const current = statusLabel(unit);
  return (
    <form onSubmit={submit} noValidate aria-label={`Status of ${unit.designation}`} data-form={`status-${unit.designation}`} className="flex flex-wrap items-end gap-3">
      <div className="w-40">
        <p className="text-small font-semibold text-hull-800">{unit.designation}</p>
        <p className="text-caption text-hull-500">
          {formatKw(unit.ratedKw)}, section {unit.busSection}
        </p>
        <Badge tone={current.tone}>{current.text}</Badge>
      </div>
      {canEdit ? (
        <>
          <Field label="Status" htmlFor={id('choice')} error={e.mustRun?.message ?? e.available?.message}>
            <Select id={id('choice')} value={choice} onChange={(ev) => choose(ev.target.value as StatusChoice)}>
              <option value="available">Available</option>
              <option value="unavailable">Unavailable (never runs)</option>
              <option value="must_run">Must run (always runs)</option>
            </Select>
          </Field>
          {choice === 'unavailable' ? (
            <Field label="Reason" htmlFor={id('reason')} error={e.unavailableReason?.message}>
              <Input
                id={id('reason')}
                placeholder="Maintenance, defect…"
                invalid={!!e.unavailableReason}
                {...form.register('unavailableReason', { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? v : null) })}
              />
            </Field>
          ) : null}
          <Button type="submit" size="sm" pending={save.isPending} pendingLabel="Saving…" disabled={!form.formState.isDirty}>
            Save status
          </Button>
          {saved && !form.formState.isDirty ? (
            <span className="text-small text-verdigris-700" role="status">
              Saved
            </span>
          ) : null}
        </>
      ) : null}
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
    </form>
  );
}
