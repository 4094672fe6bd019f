import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { OPERATING_MODE_LABELS, operatingRuleInputSchema, type OperatingRule, type OperatingRuleInput } from '../../../../shared/schemas/recommendations';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { formatDateTime } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber } from '../../../lib/number-fields';
import { usePutOperatingRule } from '../api/put-operating-rule';

const FIELD_NAMES = ['marginKw', 'marginPct', 'minSets', 'nMinus1', 'busTieClosed'] as const;

/** Why N-1 exists, printed beside the switch. */
export const N_MINUS_1_REASON =
  'SOLAS II-1/41 asks that essential services survive the loss of any one generating set: with N-1 on, the sets left after the largest running set trips must still carry the load within their maximum.';

const valuesOf = (r: OperatingRule): OperatingRuleInput => ({
  marginKw: r.marginKw,
  marginPct: r.marginPct,
  minSets: r.minSets,
  nMinus1: r.nMinus1,
  busTieClosed: r.busTieClosed,
});

/** The reserve rule of one operating mode: margin above the load, minimum sets online, N-1 and the bus tie. */
export function OperatingRuleForm({ vesselId, rule, canEdit }: { vesselId: string; rule: OperatingRule; canEdit: boolean }) {
  const save = usePutOperatingRule();
  const [saved, setSaved] = useState(false);
  const form = useForm<OperatingRuleInput>({ resolver: zodResolver(operatingRuleInputSchema, numberFieldMessages), values: valuesOf(rule) });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const e = form.formState.errors;
  const id = (name: string) => `rule-${rule.mode}-${name}`;
  const submit = form.handleSubmit((input) => {
    server.clear();
    setSaved(false);
    save.mutate({ vesselId, mode: rule.mode, rule: input }, { onSuccess: () => setSaved(true), onError: server.onError });
  });
  const numberField = (name: 'marginKw' | 'marginPct' | 'minSets', label: string, unit: string, hint: string) => (
    <Field label={label} htmlFor={id(name)} error={e[name]?.message} hint={hint}>
      <Input id={id(name)} type="number" inputMode="decimal" unit={unit} invalid={!!e[name]} {...form.register(name, { setValueAs: toNumber })} />
    </Field>
  );
  return (
    <form onSubmit={submit} noValidate aria-label={`Operating rule: ${OPERATING_MODE_LABELS[rule.mode]}`} data-form={`rule-${rule.mode}`} className="space-y-3">
      <h3 className="flex items-center gap-2 text-body font-semibold">
        {OPERATING_MODE_LABELS[rule.mode]}
        {rule.stored ? <Badge tone="good">set {formatDateTime(rule.updatedAt)}</Badge> : <Badge>default: no rule stored yet</Badge>}
      </h3>
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <fieldset disabled={!canEdit} className="grid gap-3 sm:grid-cols-3">
        {numberField('marginKw', 'Margin above the load', 'kW', 'Spinning reserve in kW')}
        {numberField('marginPct', 'or margin', '%', 'Of the load; the larger margin applies')}
        {numberField('minSets', 'Minimum sets online', 'sets', 'Whole sets')}
        <Field label="Bus tie" htmlFor={id('busTieClosed')} error={e.busTieClosed?.message} hint="Open: each section carries its own load and reserve">
          <Select id={id('busTieClosed')} {...form.register('busTieClosed', { setValueAs: (v: unknown) => v === true || v === 'true' })}>
            <option value="true">Closed (sections share the load)</option>
            <option value="false">Open (sections run apart)</option>
          </Select>
        </Field>
        <div className="sm:col-span-2">
          <label className="flex items-center gap-2 text-small font-semibold text-hull-800" htmlFor={id('nMinus1')}>
            <input id={id('nMinus1')} type="checkbox" {...form.register('nMinus1')} />
            N-1: survive the trip of the largest running set
          </label>
          <p className="mt-1 text-caption text-hull-500">{N_MINUS_1_REASON}</p>
        </div>
      </fieldset>
      {canEdit ? (
        <div className="flex items-center gap-3">
          <Button type="submit" size="sm" pending={save.isPending} pendingLabel="Saving…" disabled={!form.formState.isDirty}>
            Save {OPERATING_MODE_LABELS[rule.mode].toLowerCase()} rule
          </Button>
          {saved && !form.formState.isDirty ? <span className="text-small text-verdigris-700" role="status">Saved</span> : null}
        </div>
      ) : null}
    </form>
  );
}
