import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { OPERATING_MODE_LABELS, OPERATING_MODES, singlePointInputSchema, type OperatingModeName, type SinglePointInput, type SinglePointResult } from '../../../../shared/schemas/recommendations';
import { LazyChart } from '../../../components/charts/lazy-chart';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { Panel } from '../../../components/ui/panel';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatKg, formatKw, formatPct, formatSfoc } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber } from '../../../lib/number-fields';
import { useRecommendAtPoint } from '../api/recommend-at-point';
import { Caution } from './caution';
import { setLoadsOption } from './chart-options';

/**
 * What the schema checks for a mode: the plant load with the bus tie closed (or one section), else the load of
 * every section (a blank section becomes NaN, so the schema asks for it beside its field).
 */
function pointFor(values: SinglePointInput, busSections: readonly string[], bySection: boolean): SinglePointInput {
  if (!bySection) return { mode: values.mode, loadKw: values.loadKw };
  return { mode: values.mode, sectionLoadsKw: Object.fromEntries(busSections.map((s) => [s, values.sectionLoadsKw?.[s] ?? Number.NaN])) };
}

const optionalNumber = (v: unknown) => (v === '' || v === undefined ? undefined : toNumber(v));

/** Load input (and mode) and the ranked combinations with loads, reasons and the saving against equal split. */
export function SinglePointPanel({ vesselId, busSections, openTieModes }: { vesselId: string; busSections: string[]; openTieModes: readonly OperatingModeName[] }) {
  const run = useRecommendAtPoint();
  const splitBy = (mode: OperatingModeName) => busSections.length > 1 && openTieModes.includes(mode);
  const base = zodResolver(singlePointInputSchema, numberFieldMessages);
  const form = useForm<SinglePointInput>({
    resolver: (values, context, options) => base(pointFor(values, busSections, splitBy(values.mode)), context, options),
    defaultValues: { mode: 'sea' },
  });
  const server = useServerErrors(form.setError, ['loadKw', 'mode', 'sectionLoadsKw']);
  const bySection = splitBy(form.watch('mode'));
  const submit = form.handleSubmit((input) => {
    server.clear();
    run.mutate({ vesselId, input }, { onError: server.onError });
  });
  const e = form.formState.errors;
  const sectionError = (e.sectionLoadsKw as { message?: string } | undefined)?.message;
  return (
    <div className="space-y-4">
      <Panel title="Operating point">
        <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-3" aria-label="Recommend for one load">
          <Field label="Mode" htmlFor="sp-mode">
            <Select id="sp-mode" {...form.register('mode')}>
              {OPERATING_MODES.map((m) => (
                <option key={m} value={m}>
                  {OPERATING_MODE_LABELS[m]}
                  {splitBy(m) ? ' (bus tie open)' : ''}
                </option>
              ))}
            </Select>
          </Field>
          {bySection ? (
            busSections.map((s) => (
              <Field key={s} label={`Section ${s} load`} htmlFor={`sp-sec-${s}`} error={e.sectionLoadsKw?.[s]?.message} hint="Bus tie open: each section carries its own load">
                <Input id={`sp-sec-${s}`} unit="kW" inputMode="decimal" invalid={!!e.sectionLoadsKw?.[s]} {...form.register(`sectionLoadsKw.${s}`, { setValueAs: optionalNumber })} />
              </Field>
            ))
          ) : (
            <Field label="Electrical load" htmlFor="sp-load" error={e.loadKw?.message}>
              <Input id="sp-load" unit="kW" inputMode="decimal" invalid={!!e.loadKw} {...form.register('loadKw', { setValueAs: optionalNumber })} />
            </Field>
          )}
          <Button type="submit" pending={run.isPending} pendingLabel="Computing…">
            Recommend
          </Button>
        </form>
        {sectionError ? <p className="mt-2 text-small text-signal-700">{sectionError}</p> : null}
        {server.problem ? (
          <div className="mt-3">
            <Alert tone="error">No recommendation: {server.problem}</Alert>
          </div>
        ) : null}
      </Panel>
      <Caution />
      {run.data ? <SinglePointResultView result={run.data} /> : null}
    </div>
  );
}

function SinglePointResultView({ result }: { result: SinglePointResult }) {
  const byId = new Map(result.plant.units.map((u) => [u.gensetId, u]));
  if (!result.feasible) {
    return (
      <Alert tone="error">
        <strong data-result="infeasible">No combination of sets meets this mode&apos;s rules at {formatKw(result.loadKw)}:</strong>
        <ul className="ml-5 list-disc">
          {result.reasons.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      </Alert>
    );
  }
  const best = result.combinations[0];
  return (
    <div className="space-y-4" data-result="single-point" data-best={best.designations.join('+')}>
      <Panel title={`Run ${best.designations.join(' + ')}`}>
        <p className="text-small">
          Fuel {formatKg(best.fuelKgPerH)}/h ({formatKg(best.fuelKgPerDay)}/day), plant SFOC {formatSfoc(best.sfocGPerKwh)}, reserve left {formatKw(best.reserveKw)} (
          {formatPct(best.reservePct)} of the load).{' '}
          {result.savedFuelKgPerDay !== null
            ? `Against equal load sharing on the same sets (${formatKg(result.equalSplitFuelKgPerH)}/h) the optimal split saves ${formatKg(result.savedFuelKgPerDay)}/day.`
            : `Equal split not possible: ${result.equalSplitReason ?? ''}`}
        </p>
        <Table caption="Why each set is on or off">
          <thead>
            <tr>
              <Th>Set</Th>
              <Th numeric>Load</Th>
              <Th numeric>Fuel rate</Th>
              <Th>Curve</Th>
              <Th>Reason</Th>
            </tr>
          </thead>
          <tbody>
            {result.unitReasons.map((r) => {
              const load = best.units.find((u) => u.gensetId === r.gensetId);
              const unit = byId.get(r.gensetId);
              return (
                <tr key={r.gensetId}>
                  <Td>
                    {r.designation} <Badge tone={r.on ? 'good' : 'neutral'}>{r.on ? 'on' : 'off'}</Badge>
                  </Td>
                  <Td numeric>{load ? `${formatKw(load.loadKw)} (${formatPct(load.loadPct)})` : '–'}</Td>
                  <Td numeric>{load ? `${formatKg(load.fuelKgPerH)}/h` : '–'}</Td>
                  <Td>{unit ? (unit.curveSource === 'fit' ? 'fit' : 'shop test') : '–'}</Td>
                  <Td>{r.reason}</Td>
                </tr>
              );
            })}
          </tbody>
        </Table>
      </Panel>
      <Panel title="Set loads of the best combinations">
        <LazyChart option={setLoadsOption(result.combinations)} heightPx={300} label="Stacked set loads in kW of the five cheapest combinations" />
      </Panel>
      <Panel title="Every feasible combination, least fuel first">
        <Table caption="Feasible combinations">
          <thead>
            <tr>
              <Th numeric>Rank</Th>
              <Th>Sets</Th>
              <Th numeric>Fuel rate</Th>
              <Th numeric>Fuel per day</Th>
              <Th numeric>Plant SFOC</Th>
              <Th numeric>Reserve left</Th>
            </tr>
          </thead>
          <tbody>
            {result.combinations.map((c) => (
              <tr key={c.gensetIds.join()} data-rank={c.rank} data-sets={c.designations.join('+')} data-fuel-kg-per-h={c.fuelKgPerH}>
                <Td numeric>{c.rank}</Td>
                <Td>{c.units.map((u) => `${u.designation} ${formatKw(u.loadKw)}`).join(', ')}</Td>
                <Td numeric>{formatKg(c.fuelKgPerH)}/h</Td>
                <Td numeric>{formatKg(c.fuelKgPerDay)}</Td>
                <Td numeric>{formatSfoc(c.sfocGPerKwh)}</Td>
                <Td numeric>{formatKw(c.reserveKw)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
    </div>
  );
}
