import { useState, type FormEvent } from 'react';
import { OPERATING_MODES, type OperatingModeName } from '../../../../shared/schemas/recommendations';
import type { ProfilePeriod } from '../../../../shared/schemas/plans';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { useCreatePlan } from '../api/create-plan';

/** Parses "hours, mode, load kW" lines (typed, pasted or read from a CSV file); header lines are skipped. */
export function parseProfile(text: string): { periods: ProfilePeriod[]; errors: string[] } {
  const periods: ProfilePeriod[] = [];
  const errors: string[] = [];
  text.split(/\r?\n/).forEach((line, i) => {
    const cells = line.split(/[;,\t]/).map((c) => c.trim());
    if (!line.trim() || Number.isNaN(Number(cells[0]))) return;
    const [h, mode, kw] = cells;
    if (!(OPERATING_MODES as readonly string[]).includes(mode)) errors.push(`line ${i + 1}: mode must be one of ${OPERATING_MODES.join(', ')}`);
    else periods.push({ durationH: Number(h), mode: mode as OperatingModeName, loadKw: Number(kw) });
  });
  return { periods, errors };
}

/** New voyage plan from a load profile; the server solves it in the background. */
export function PlanForm({ vesselId, onCreated }: { vesselId: string; onCreated: (planId: string) => void }) {
  const create = useCreatePlan();
  const [name, setName] = useState('');
  const [text, setText] = useState('hours,mode,load kW\n6,sea,900\n6,sea,1100\n2,manoeuvring,1500\n10,port,600');
  const [errors, setErrors] = useState<string[]>([]);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = parseProfile(text);
    if (parsed.errors.length || !parsed.periods.length) return setErrors(parsed.errors.length ? parsed.errors : ['Enter at least one period']);
    setErrors([]);
    create.mutate(
      { vesselId, input: { name: name || 'Voyage plan', profileSource: 'typed', periods: parsed.periods } },
      { onSuccess: (p) => onCreated(p.id), onError: (e) => setErrors([e.message]) },
    );
  };
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="New voyage plan">
      <Field label="Plan name" htmlFor="plan-name">
        <Input id="plan-name" value={name} onChange={(e) => setName(e.target.value)} placeholder="Rotterdam – Santos" />
      </Field>
      <Field label="Load profile (hours, mode, load kW per line; up to 30 days)" htmlFor="plan-profile">
        <textarea id="plan-profile" className="h-40 w-full rounded border p-2 font-mono text-small" value={text} onChange={(e) => setText(e.target.value)} />
      </Field>
      <Field label="or read a CSV file" htmlFor="plan-csv">
        <input id="plan-csv" type="file" accept=".csv,text/csv" onChange={async (e) => e.target.files?.[0] && setText(await e.target.files[0].text())} />
      </Field>
      {errors.length ? <Alert tone="error">{errors.join('; ')}</Alert> : null}
      <Button type="submit" pending={create.isPending} pendingLabel="Queuing…">
        Plan
      </Button>
    </form>
  );
}
