import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { SUBSCRIPTION_KINDS, SUBSCRIPTION_LABELS, subscriptionInputSchema, type SubscriptionInput, type SubscriptionKind } from '../../../../shared/schemas/reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumberOrNull } from '../../../lib/number-fields';
import { useCreateSubscription } from '../api/create-subscription';

const FIELD_NAMES = ['kind', 'vesselId', 'hoursBefore'] as const;

const WHAT_IT_SENDS: Record<SubscriptionKind, string> = {
  vessel_monthly_report: 'After each month: the vessel’s monthly report by e-mail, with the XLSX attached and a link back.',
  fleet_monthly_report: 'After each month: the fleet report by e-mail, with the XLSX attached and a link back.',
  drift_alert: 'An e-mail when a set’s SFOC has drifted above the alert threshold (one vessel, or every vessel you may see).',
  overhaul_alert: 'An e-mail when a set comes within the chosen running hours of a maintenance due.',
};

interface SubscribeFormProps {
  vessels: readonly { id: string; name: string }[];
  /** Whether the member may receive the fleet report ('reports:read'). */
  mayReceiveFleetReport: boolean;
}

/** Subscribe the signed-in member to a report or an alert. */
export function SubscribeForm({ vessels, mayReceiveFleetReport }: SubscribeFormProps) {
  const create = useCreateSubscription();
  const kinds = SUBSCRIPTION_KINDS.filter((k) => k !== 'fleet_monthly_report' || mayReceiveFleetReport);
  const form = useForm<SubscriptionInput, unknown, z.output<typeof subscriptionInputSchema>>({
    resolver: zodResolver(subscriptionInputSchema, numberFieldMessages),
    defaultValues: { kind: 'vessel_monthly_report', vesselId: vessels[0]?.id ?? null, hoursBefore: null },
    shouldUnregister: true,
  });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const e = form.formState.errors;
  const kind = form.watch('kind');
  const submit = form.handleSubmit((input) => {
    server.clear();
    create.mutate(input, { onError: server.onError });
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Subscribe" data-form="subscribe" className="flex flex-col gap-3">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      {create.isSuccess ? <Alert tone="success">Subscribed. The list below shows what you receive.</Alert> : null}
      <div className="flex flex-wrap items-end gap-3">
        <Field label="What" htmlFor="sub-kind" error={e.kind?.message}>
          <Select id="sub-kind" {...form.register('kind')}>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {SUBSCRIPTION_LABELS[k]}
              </option>
            ))}
          </Select>
        </Field>
        {kind !== 'fleet_monthly_report' ? (
          <Field label="Vessel" htmlFor="sub-vessel" error={e.vesselId?.message}>
            <Select id="sub-vessel" invalid={!!e.vesselId} {...form.register('vesselId', { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : String(v)) })}>
              {kind !== 'vessel_monthly_report' ? <option value="">Every vessel I may see</option> : null}
              {vessels.map((v) => (
                <option key={v.id} value={v.id}>
                  {v.name}
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
        {kind === 'overhaul_alert' ? (
          <Field label="Hours before due" htmlFor="sub-hours" error={e.hoursBefore?.message} hint="Blank: the standard warning hours">
            <Input id="sub-hours" type="number" min={0} step={50} unit="h" className="w-40" invalid={!!e.hoursBefore} {...form.register('hoursBefore', { setValueAs: toNumberOrNull })} />
          </Field>
        ) : null}
        <Button type="submit" pending={create.isPending} pendingLabel="Subscribing…">
          Subscribe
        </Button>
      </div>
      <p className="text-small text-hull-600">{WHAT_IT_SENDS[kind]}</p>
    </form>
  );
}
