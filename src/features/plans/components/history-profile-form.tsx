import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';
import { historyProfileInputSchema, type HistoryProfile, type HistoryProfileInput } from '../../../../shared/schemas/plans';
import { OPERATING_MODE_LABELS, OPERATING_MODES } from '../../../../shared/schemas/recommendations';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { formatHours, formatKw } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber } from '../../../lib/number-fields';
import { useHistoryProfile } from '../api/history-profile';

const FIELD_NAMES = ['from', 'to', 'sequence', 'periodH'] as const;

const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/** The 90 days up to `lastDay` (the vessel's latest logged day, so the window holds logs). */
function defaults(lastDay: Date): HistoryProfileInput {
  return {
    from: isoDay(new Date(lastDay.getTime() - 90 * 86_400_000)),
    to: isoDay(lastDay),
    periodH: 6,
    sequence: [
      { mode: 'port', hours: 12 },
      { mode: 'manoeuvring', hours: 2 },
      { mode: 'sea', hours: 120 },
      { mode: 'manoeuvring', hours: 2 },
      { mode: 'port', hours: 24 },
    ],
  };
}

/**
 * A load profile from the vessel's logged history: the average load of each mode over a window of days, laid
 * along a sequence of legs (mode and hours). The result goes to `onProfile`, where the user edits it before solving.
 */
export function HistoryProfileForm({ vesselId, lastLogDate, onProfile }: { vesselId: string; lastLogDate?: string | null; onProfile: (profile: HistoryProfile) => void }) {
  const build = useHistoryProfile();
  const form = useForm<HistoryProfileInput, unknown, z.output<typeof historyProfileInputSchema>>({
    resolver: zodResolver(historyProfileInputSchema, numberFieldMessages),
    defaultValues: defaults(lastLogDate ? new Date(`${lastLogDate}T00:00:00Z`) : new Date()),
  });
  const legs = useFieldArray({ control: form.control, name: 'sequence' });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const e = form.formState.errors;
  const sequence = form.watch('sequence');
  const totalH = sequence.reduce((s, l) => s + (Number.isFinite(l.hours) ? l.hours : 0), 0);
  const submit = form.handleSubmit((input) => {
    server.clear();
    build.mutate({ vesselId, input }, { onSuccess: onProfile, onError: server.onError });
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Load profile from logged history" data-form="history-profile" className="space-y-3">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <Field label="Logged days from" htmlFor="hist-from" error={e.from?.message}>
          <Input id="hist-from" type="date" invalid={!!e.from} {...form.register('from')} />
        </Field>
        <Field label="to" htmlFor="hist-to" error={e.to?.message}>
          <Input id="hist-to" type="date" invalid={!!e.to} {...form.register('to')} />
        </Field>
        <Field label="Period length" htmlFor="hist-period" error={e.periodH?.message} hint="1 to 24 h per period">
          <Input id="hist-period" type="number" inputMode="decimal" unit="h" invalid={!!e.periodH} {...form.register('periodH', { setValueAs: toNumber })} />
        </Field>
      </div>
      <fieldset className="space-y-2">
        <legend className="text-small font-semibold text-hull-800">Legs in order (mode and hours); total {formatHours(totalH)} of at most 720 h</legend>
        {legs.fields.map((leg, i) => (
          <div key={leg.id} className="flex flex-wrap items-end gap-2" data-leg={i}>
            <Field label={`Leg ${i + 1} mode`} htmlFor={`hist-leg-${i}-mode`}>
              <Select id={`hist-leg-${i}-mode`} {...form.register(`sequence.${i}.mode`)}>
                {OPERATING_MODES.map((m) => (
                  <option key={m} value={m}>
                    {OPERATING_MODE_LABELS[m]}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Hours" htmlFor={`hist-leg-${i}-hours`} error={e.sequence?.[i]?.hours?.message}>
              <Input id={`hist-leg-${i}-hours`} type="number" inputMode="decimal" unit="h" invalid={!!e.sequence?.[i]?.hours} {...form.register(`sequence.${i}.hours`, { setValueAs: toNumber })} />
            </Field>
            <Button variant="quiet" size="sm" onClick={() => legs.remove(i)} disabled={legs.fields.length <= 1} aria-label={`Remove leg ${i + 1}`}>
              Remove
            </Button>
          </div>
        ))}
        {e.sequence?.message || e.sequence?.root?.message ? <p className="text-caption font-semibold text-signal-600">{e.sequence.message ?? e.sequence.root?.message}</p> : null}
        <Button variant="secondary" size="sm" onClick={() => legs.append({ mode: 'sea', hours: 24 })} disabled={legs.fields.length >= 100}>
          Add leg
        </Button>
      </fieldset>
      <Button type="submit" variant="secondary" pending={build.isPending} pendingLabel="Reading the logs…">
        Build the profile from the logs
      </Button>
      {build.data ? (
        <div className="space-y-2 text-small" data-result="history-profile">
          <p>
            Average load per mode over the window:{' '}
            {build.data.modeLoads.map((m) => `${OPERATING_MODE_LABELS[m.mode]} ${m.loadKw === null ? 'not logged' : `${formatKw(m.loadKw)} (${m.days} days)`}`).join(' · ')}
          </p>
          {build.data.warnings.length ? (
            <Alert tone="info">
              <ul className="ml-5 list-disc">
                {build.data.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            </Alert>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
