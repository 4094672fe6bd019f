import { createColumnHelper } from '@tanstack/react-table';
import type { FleetSetRow, FleetVesselRow } from '../../../../shared/schemas/fleet';
import type { IntervalAmountView } from '../../../../shared/schemas/savings';
import { Badge } from '../../../components/ui/badge';
import { formatHours, formatKw, formatPct, formatSfoc, formatTonnes } from '../../../lib/format';
import type { BenchmarkColumn, BenchmarkFeatures } from './benchmark-table';

const vessel = createColumnHelper<BenchmarkFeatures, FleetVesselRow>();
const set = createColumnHelper<BenchmarkFeatures, FleetSetRow>();

/** Missing figures sort last in either direction. */
const num = { sortUndefined: 'last', sortFn: 'basic' } as const;
const orUndefined = (v: number | null) => v ?? undefined;
const mwh = (v: number | undefined) => (v === undefined ? '–' : `${v.toLocaleString('en-GB', { maximumFractionDigits: 1 })}\u00a0MWh`);
const withInterval = (a: IntervalAmountView | null) => (a ? `${formatTonnes(a.value)} (${formatTonnes(a.lower)} to ${formatTonnes(a.upper)})` : '–');

/** Column id → key of the API's `method` texts, for the tooltips. */
export const METHOD_KEY_OF_COLUMN: Record<string, string> = {
  plantSfoc: 'plantSfoc',
  sfocIso: 'plantSfoc',
  sfoc75: 'sfoc75',
  loadFactor: 'loadFactor',
  lowLoad: 'lowLoad',
  avoidableT: 'avoidable',
  avoidablePct: 'avoidable',
  avoidableCo2T: 'avoidable',
  drift: 'drift',
  hoursSpread: 'balance',
  hoursCv: 'balance',
  hoursSinceOverhaul: 'balance',
  hoursToOverhaul: 'overhaul',
};

/** The method texts by column id, from the API's `method` record. */
export function howByColumn(method: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(METHOD_KEY_OF_COLUMN).map(([col, key]) => [col, method[key] ?? '']));
}

export const VESSEL_NUMERIC = ['sets', 'energy', 'plantSfoc', 'loadFactor', 'lowLoad', 'avoidableT', 'avoidablePct', 'avoidableCo2T', 'drift', 'hoursSpread', 'hoursCv', 'hoursToOverhaul'] as const;

export const vesselColumns: ReadonlyArray<BenchmarkColumn<FleetVesselRow>> = vessel.columns([
  vessel.accessor('vesselName', { id: 'vessel', header: 'Vessel', sortFn: 'alphanumeric', filterFn: 'includesString' }),
  vessel.accessor('setCount', { id: 'sets', header: 'Sets', ...num }),
  vessel.accessor('energyMwh', { id: 'energy', header: 'Energy (MWh)', cell: (c) => mwh(c.getValue()), ...num }),
  vessel.accessor((r) => orUndefined(r.plantSfocIsoGPerKwh), { id: 'plantSfoc', header: 'Plant SFOC ISO (g/kWh)', cell: (c) => formatSfoc(c.getValue()), ...num }),
  vessel.accessor((r) => orUndefined(r.avgLoadFactorPct), { id: 'loadFactor', header: 'Avg load factor (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  vessel.accessor((r) => orUndefined(r.lowLoadHoursSharePct), { id: 'lowLoad', header: 'Hours below min load (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  vessel.accessor((r) => r.avoidableFuelT?.value, {
    id: 'avoidableT',
    header: 'Avoidable fuel (t, interval)',
    cell: (c) => (c.row.original.avoidableFuelT ? withInterval(c.row.original.avoidableFuelT) : <span title={c.row.original.savingsUnavailable ?? ''}>{c.row.original.savingsUnavailable ? 'not costed' : '–'}</span>),
    ...num,
  }),
  vessel.accessor((r) => orUndefined(r.avoidablePct), { id: 'avoidablePct', header: 'Avoidable fuel (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  vessel.accessor((r) => r.avoidableCo2T?.value, { id: 'avoidableCo2T', header: 'Avoidable CO2 (t, interval)', cell: (c) => withInterval(c.row.original.avoidableCo2T), ...num }),
  vessel.accessor('driftAlerts', { id: 'drift', header: 'Drift alerts (sets)', cell: (c) => (c.getValue() > 0 ? <Badge tone="bad">{`${c.getValue()} set${c.getValue() === 1 ? '' : 's'}`}</Badge> : '0 sets'), ...num }),
  vessel.accessor((r) => orUndefined(r.hoursSinceOverhaulSpreadH), { id: 'hoursSpread', header: 'Hours since overhaul, max − min (h)', cell: (c) => formatHours(c.getValue()), ...num }),
  vessel.accessor((r) => orUndefined(r.periodHoursCvPct), { id: 'hoursCv', header: 'Period hours CV (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  vessel.accessor((r) => orUndefined(r.minHoursToOverhaulH), { id: 'hoursToOverhaul', header: 'Hours to next overhaul (h)', cell: (c) => formatHours(c.getValue()), ...num }),
]);

export const SET_NUMERIC = ['rated', 'hours', 'sfocIso', 'sfoc75', 'loadFactor', 'lowLoad', 'drift', 'hoursSinceOverhaul', 'hoursToOverhaul'] as const;

export const setColumns: ReadonlyArray<BenchmarkColumn<FleetSetRow>> = set.columns([
  set.accessor('vesselName', { id: 'vessel', header: 'Vessel', sortFn: 'alphanumeric', filterFn: 'includesString' }),
  set.accessor('designation', { id: 'set', header: 'Set', sortFn: 'alphanumeric' }),
  set.accessor('ratedKw', { id: 'rated', header: 'Rating (kW)', cell: (c) => formatKw(c.getValue()), ...num }),
  set.accessor('curveSource', { id: 'curve', header: 'Curve', cell: (c) => (c.getValue() === 'fit' ? 'fitted' : 'shop test'), sortFn: 'alphanumeric' }),
  set.accessor('hoursRun', { id: 'hours', header: 'Hours run (h)', cell: (c) => formatHours(c.getValue()), ...num }),
  set.accessor((r) => orUndefined(r.sfocIsoGPerKwh), { id: 'sfocIso', header: 'SFOC ISO (g/kWh)', cell: (c) => formatSfoc(c.getValue()), ...num }),
  set.accessor('sfoc75GPerKwh', { id: 'sfoc75', header: 'SFOC at 75 % (g/kWh)', cell: (c) => formatSfoc(c.getValue()), ...num }),
  set.accessor((r) => orUndefined(r.avgLoadFactorPct), { id: 'loadFactor', header: 'Avg load factor (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  set.accessor((r) => orUndefined(r.lowLoadHoursSharePct), { id: 'lowLoad', header: 'Hours below min load (%)', cell: (c) => formatPct(c.getValue()), ...num }),
  set.accessor((r) => (r.driftAlert ? 1 : 0), {
    id: 'drift',
    header: 'Drift (g/kWh above)',
    cell: (c) => (c.row.original.driftAlert ? <Badge tone="bad">{`alert, ${formatSfoc(c.row.original.driftExcessGPerKwh)}`}</Badge> : 'none'),
    ...num,
  }),
  set.accessor((r) => orUndefined(r.hoursSinceOverhaulH), { id: 'hoursSinceOverhaul', header: 'Hours since overhaul (h)', cell: (c) => formatHours(c.getValue()), ...num }),
  set.accessor((r) => orUndefined(r.hoursToNextOverhaulH), {
    id: 'hoursToOverhaul',
    header: 'Hours to next overhaul (h)',
    cell: (c) => (c.getValue() === undefined ? '–' : `${formatHours(c.getValue())}${c.row.original.nextOverhaulKind ? ` (${c.row.original.nextOverhaulKind})` : ''}`),
    ...num,
  }),
]);
