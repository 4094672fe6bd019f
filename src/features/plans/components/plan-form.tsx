import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useFieldArray, useForm, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { PLAN_LIMITS, planInputSchema, type HistoryProfile, type PlanInput, type ProfilePeriod } from '../../../../shared/schemas/plans';
import { OPERATING_MODE_LABELS, OPERATING_MODES, type OperatingModeName } from '../../../../shared/schemas/recommendations';
import { LazyChart } from '../../../components/charts/lazy-chart';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatHours, formatKw } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber } from '../../../lib/number-fields';
import { useCreatePlan } from '../api/create-plan';
import { HistoryProfileForm } from './history-profile-form';
import { profileOption } from './profile-chart';

type PlanOutput = z.output<typeof planInputSchema>;
const FIELD_NAMES = ['name', 'profileSource', 'periods', 'hourBudgetsH'] as const;
const EXAMPLE_PROFILE = 'hours,mode,load kW\n6,sea,900\n6,sea,1100\n2,manoeuvring,1500\n10,port,600';

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

/** Bus sections whose loads a period of this mode takes: all of them when the mode's tie is open and there are several. */
const sectionsOf = (mode: OperatingModeName, busSections: readonly string[], openTieModes: readonly OperatingModeName[]) =>
  busSections.length > 1 && openTieModes.includes(mode) ? busSections : [];

/**
 * The periods as the server takes them: with the tie open and every section's load entered, the plant load is
 * their sum; with none entered (or the tie closed) no section loads are sent and the server shares the load by
 * capacity. A half-filled row is left as it is, so the schema reports the missing section.
 */
export function tidyPeriods(periods: readonly ProfilePeriod[], busSections: readonly string[], openTieModes: readonly OperatingModeName[]): ProfilePeriod[] {
  return periods.map((p) => {
    const { sectionLoadsKw, ...plain } = p;
    const sections = sectionsOf(p.mode, busSections, openTieModes);
    const given = sections.map((s) => sectionLoadsKw?.[s]);
    if (!sections.length || given.every((v) => v === undefined || Number.isNaN(v))) return plain;
    if (given.every((v) => typeof v === 'number' && Number.isFinite(v))) {
      const loads = Object.fromEntries(sections.map((s, i) => [s, given[i] as number]));
      return { ...plain, loadKw: Object.values(loads).reduce((a, b) => a + b, 0), sectionLoadsKw: loads };
    }
    return { ...plain, sectionLoadsKw: Object.fromEntries(sections.map((s, i) => [s, given[i] as number])) };
  });
}

interface PlanFormProps {
  vesselId: string;
  /** Names of the vessel's bus sections (from the plant model). */
  busSections: readonly string[];
  /** Modes whose operating rule has the bus tie open: their periods take a load per section. */
  openTieModes: readonly OperatingModeName[];
  onCreated: (planId: string) => void;
  /** The vessel's latest logged day: the history window ends there. */
  lastLogDate?: string | null;
}

/**
 * New voyage plan: a load profile typed, pasted, read from CSV or built from the logged history, edited period
 * by period (with per-section loads where the bus tie is open), then solved by the server in the background.
 */
export function PlanForm({ vesselId, busSections, openTieModes, onCreated, lastLogDate }: PlanFormProps) {
  const create = useCreatePlan();
  const baseResolver = zodResolver(planInputSchema, numberFieldMessages);
  const resolver: Resolver<PlanInput, unknown, PlanOutput> = (values, context, options) =>
    baseResolver({ ...values, periods: tidyPeriods(values.periods as ProfilePeriod[], busSections, openTieModes) }, context, options);
  const form = useForm<PlanInput, unknown, PlanOutput>({
    resolver,
    defaultValues: { name: '', profileSource: 'typed', periods: parseProfile(EXAMPLE_PROFILE).periods },
  });
  const rows = useFieldArray({ control: form.control, name: 'periods' });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const [text, setText] = useState(EXAMPLE_PROFILE);
  const [textErrors, setTextErrors] = useState<string[]>([]);
  const [historyNote, setHistoryNote] = useState<string | null>(null);
  const e = form.formState.errors;
  const periods = (form.watch('periods') ?? []) as ProfilePeriod[];
  const tidy = tidyPeriods(periods, busSections, openTieModes);
  const horizonH = tidy.reduce((s, p) => s + (Number.isFinite(p.durationH) ? p.durationH : 0), 0);
  const someOpen = busSections.length > 1 && openTieModes.length > 0;

  const load = (next: ProfilePeriod[], source: 'typed' | 'csv' | 'history') => {
    rows.replace(next);
    form.setValue('profileSource', source);
  };
  const readText = (source: 'typed' | 'csv', value: string) => {
    const parsed = parseProfile(value);
    setTextErrors(parsed.errors.length ? parsed.errors : parsed.periods.length ? [] : ['No period found: one line per period, "hours, mode, load kW"']);
    if (!parsed.errors.length && parsed.periods.length) load(parsed.periods, source);
  };
  const fromHistory = (profile: HistoryProfile) => {
    if (profile.periods.length) load(profile.periods, 'history');
    setHistoryNote(profile.periods.length ? `${profile.periods.length} periods from the logs; check and edit them below before planning.` : 'The logs gave no period for these legs.');
  };
  const submit = form.handleSubmit((input) => {
    server.clear();
    create.mutate({ vesselId, input: { ...input, name: input.name || 'Voyage plan' } }, { onSuccess: (p) => onCreated(p.id), onError: server.onError });
  });

  return (
    <div className="space-y-6">
      <section className="grid gap-6 lg:grid-cols-2">
        <div className="space-y-2">
          <h3 className="text-body font-semibold">Type, paste or read a CSV file</h3>
          <Field label="Hours, mode, load kW per line" htmlFor="plan-profile" hint={`Modes: ${OPERATING_MODES.join(', ')}`}>
            <textarea id="plan-profile" className="h-32 w-full rounded-plate border border-hull-200 p-2 font-mono text-small" value={text} onChange={(ev) => setText(ev.target.value)} />
          </Field>
          <div className="flex flex-wrap items-center gap-3">
            <Button variant="secondary" size="sm" onClick={() => readText('typed', text)} data-action="read-profile-text">
              Use these lines
            </Button>
            <label className="text-small" htmlFor="plan-csv">
              or a CSV file{' '}
              <input
                id="plan-csv"
                type="file"
                accept=".csv,text/csv"
                onChange={async (ev) => {
                  const file = ev.target.files?.[0];
                  if (!file) return;
                  const content = await file.text();
                  setText(content);
                  readText('csv', content);
                }}
              />
            </label>
          </div>
          {textErrors.length ? <Alert tone="error">{textErrors.join('; ')}</Alert> : null}
        </div>
        <div className="space-y-2">
          <h3 className="text-body font-semibold">Build from the logged history</h3>
          <HistoryProfileForm vesselId={vesselId} lastLogDate={lastLogDate} onProfile={fromHistory} />
          {historyNote ? <Alert tone="info">{historyNote}</Alert> : null}
        </div>
      </section>

      <form onSubmit={submit} noValidate className="space-y-4" aria-label="New voyage plan" data-form="plan">
        {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
        <Field label="Plan name" htmlFor="plan-name" error={e.name?.message}>
          <Input id="plan-name" placeholder="Rotterdam – Santos" invalid={!!e.name} {...form.register('name')} />
        </Field>
        <div>
          <h3 className="text-body font-semibold">
            Load profile: {tidy.length} periods, {formatHours(horizonH)} of at most {formatHours(PLAN_LIMITS.maxHorizonH)}
          </h3>
          {someOpen ? (
            <p className="text-caption text-hull-500">
              Bus tie open in {openTieModes.map((m) => OPERATING_MODE_LABELS[m].toLowerCase()).join(', ')}: enter each section&apos;s load there, or leave them all blank to share the
              load by the sections&apos; capacity.
            </p>
          ) : null}
          {e.periods?.message || e.periods?.root?.message ? <p className="text-caption font-semibold text-signal-600">{e.periods.message ?? e.periods.root?.message}</p> : null}
        </div>
        {tidy.length ? <LazyChart option={profileOption(tidy)} heightPx={220} label="Plant load of the profile in kW over hours from the plan start" /> : null}
        <Table caption="Periods of the load profile">
          <thead>
            <tr>
              <Th numeric>#</Th>
              <Th>Duration (h)</Th>
              <Th>Mode</Th>
              <Th>Plant load (kW)</Th>
              {someOpen ? <Th>Section loads (kW, tie open)</Th> : null}
              <Th>
                <span className="sr-only">Remove</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {rows.fields.map((row, i) => {
              const rowErrors = e.periods?.[i];
              const sections = sectionsOf(periods[i]?.mode ?? row.mode, busSections, openTieModes);
              const summed = tidy[i]?.sectionLoadsKw && Object.values(tidy[i].sectionLoadsKw!).every(Number.isFinite) ? tidy[i].loadKw : null;
              return (
                <tr key={row.id} data-period={i}>
                  <Td numeric>{i + 1}</Td>
                  <Td>
                    <Input
                      aria-label={`Period ${i + 1} duration`}
                      type="number"
                      inputMode="decimal"
                      unit="h"
                      invalid={!!rowErrors?.durationH}
                      {...form.register(`periods.${i}.durationH`, { setValueAs: toNumber })}
                    />
                    {rowErrors?.durationH ? <p className="text-caption text-signal-600">{rowErrors.durationH.message}</p> : null}
                  </Td>
                  <Td>
                    <Select aria-label={`Period ${i + 1} mode`} {...form.register(`periods.${i}.mode`)}>
                      {OPERATING_MODES.map((m) => (
                        <option key={m} value={m}>
                          {OPERATING_MODE_LABELS[m]}
                        </option>
                      ))}
                    </Select>
                  </Td>
                  <Td>
                    <Input
                      aria-label={`Period ${i + 1} plant load`}
                      type="number"
                      inputMode="decimal"
                      unit="kW"
                      invalid={!!rowErrors?.loadKw}
                      readOnly={summed !== null}
                      {...form.register(`periods.${i}.loadKw`, { setValueAs: toNumber })}
                    />
                    {summed !== null ? <p className="text-caption text-hull-500">Sum of sections: {formatKw(summed)}</p> : null}
                    {rowErrors?.loadKw ? <p className="text-caption text-signal-600">{rowErrors.loadKw.message}</p> : null}
                  </Td>
                  {someOpen ? (
                    <Td>
                      {sections.length ? (
                        <div className="flex flex-wrap gap-2">
                          {sections.map((s) => (
                            <Input
                              key={s}
                              aria-label={`Period ${i + 1} load of section ${s}`}
                              placeholder={s}
                              type="number"
                              inputMode="decimal"
                              unit={`kW ${s}`}
                              className="w-36"
                              {...form.register(`periods.${i}.sectionLoadsKw.${s}`, { setValueAs: (v: unknown) => (v === '' || v === undefined ? undefined : toNumber(v)) })}
                            />
                          ))}
                        </div>
                      ) : (
                        <span className="text-caption text-hull-500">tie closed</span>
                      )}
                      {rowErrors?.sectionLoadsKw ? <p className="text-caption text-signal-600">Enter every section&apos;s load (0 kW or more), or none</p> : null}
                    </Td>
                  ) : null}
                  <Td>
                    <Button variant="quiet" size="sm" onClick={() => rows.remove(i)} disabled={rows.fields.length <= 1} aria-label={`Remove period ${i + 1}`}>
                      Remove
                    </Button>
                  </Td>
                </tr>
              );
            })}
          </tbody>
        </Table>
        <div className="flex flex-wrap gap-3">
          <Button
            variant="secondary"
            size="sm"
            disabled={rows.fields.length >= PLAN_LIMITS.maxPeriods}
            onClick={() => rows.append({ durationH: 6, mode: periods[periods.length - 1]?.mode ?? 'sea', loadKw: periods[periods.length - 1]?.loadKw ?? 0 })}
          >
            Add period
          </Button>
          <Button type="submit" pending={create.isPending} pendingLabel="Queuing…" data-action="solve-plan">
            Plan
          </Button>
        </div>
      </form>
    </div>
  );
}
