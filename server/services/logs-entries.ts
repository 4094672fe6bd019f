/**
 * The log table (derived on read, then filtered, sorted and paged on the server), CSV export, manual entry and edit
 * of a genset-day, exclusion from curve fitting, meter replacements and vessel mode hours. Every change is audited.
 */
import { and, asc, eq, gte, lte } from 'drizzle-orm';
import { dayNumber, dateOfDayNumber } from '../../optimizer/index';
import {
  logEntryInputSchema,
  type ExclusionInput,
  type LogEntryInput,
  type LogList,
  type LogListQuery,
  type LogRow,
  type MeterReplacementInput,
  type MeterReplacementRow,
  type ModeHoursInput,
  type ModeHoursRow,
} from '../../shared/schemas/logs';
import { exclusionInputSchema, logListQuerySchema, meterReplacementInputSchema, modeHoursInputSchema } from '../../shared/schemas/logs';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { gensetDailyLogs, gensets, meterReplacements, vesselModeHours } from '../db/schema';
import { AppError, notFound } from '../errors';
import { writeCsv } from '../lib/csv';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadStoredLogs, loadVesselLogContext, rawOf, type StoredLog } from './logs-data';
import { deriveSetDays, rawValueIssues, resolveLot } from './logs-derive';

function dayBefore(date: string): string {
  return dateOfDayNumber(dayNumber(date) - 1);
}

/** Every stored day of the vessel in [from, to] with derived figures and flags, plus the missing days. */
async function derivedRows(db: DbOrTx, vesselId: string, q: { gensetId?: string; from?: string; to?: string }): Promise<{ rows: LogRow[]; missingDays: LogList['missingDays'] }> {
  const ctx = await loadVesselLogContext(db, vesselId);
  const sets = ctx.sets.filter((s) => !q.gensetId || s.id === q.gensetId);
  if (q.gensetId && sets.length === 0) throw notFound('Genset');
  const stored = await loadStoredLogs(db, sets.map((s) => s.id), q.from ? dayBefore(q.from) : undefined, q.to);
  const rows: LogRow[] = [];
  const missingDays: LogList['missingDays'] = [];
  for (const set of sets) {
    const mine = stored.filter((s) => s.gensetId === set.id);
    const inRange = mine.filter((s) => !q.from || s.logDate >= q.from);
    if (!inRange.length) continue;
    const { byDate, missingDays: missing } = deriveSetDays(
      set,
      mine.map((s) => ({ logDate: s.logDate, values: rawOf(s) })),
      ctx.lotsById,
      ctx.lotsByDate,
      ctx.replacements.get(set.id) ?? new Map(),
      { dayLengthsH: ctx.dayLengthsH },
    );
    for (const date of missing) if ((!q.from || date >= q.from) && (!q.to || date <= q.to)) missingDays.push({ gensetId: set.id, designation: set.designation, date });
    for (const s of inRange) {
      const d = byDate.get(s.logDate);
      rows.push(toRow(s, set.designation, set.ratedKw, d?.derived, d?.flags ?? []));
    }
  }
  return { rows, missingDays };
}

function toRow(s: StoredLog, designation: string, ratedKw: number, derived: LogRow['derived'] | undefined, flags: LogRow['flags']): LogRow {
  return {
    id: s.id,
    gensetId: s.gensetId,
    designation,
    logDate: s.logDate,
    ratedKw,
    ...rawOf(s),
    excludedFromFit: s.excludedFromFit,
    excludeReason: s.excludeReason,
    source: s.source,
    importId: s.importId,
    derived: derived ?? {
      hoursRun: null,
      kwh: null,
      avgLoadKw: null,
      avgLoadPct: null,
      fuelKgAt15: null,
      fuelKgIso: null,
      lcvKjPerKg: null,
      lcvBasis: null,
      sfocObservedGPerKwh: null,
      sfocIsoGPerKwh: null,
      co2Kg: null,
      fuelLotReference: null,
      usable: false,
    },
    flags,
  };
}

/** One page of the vessel's log table: filters (set, date range, flag), sorting on raw or derived columns. */
export async function listLogs(deps: AppDeps, actor: Actor, vesselId: string, rawQuery: LogListQuery): Promise<LogList> {
  const q = logListQuerySchema.parse(rawQuery);
  await vesselForActor(deps.db, actor, vesselId);
  const { rows, missingDays } = await derivedRows(deps.db, vesselId, q);
  const filtered = q.flag ? rows.filter((r) => r.flags.some((f) => f.code === q.flag)) : rows;
  const key = q.sort;
  const value = (r: LogRow): string | number | null =>
    key === 'logDate' ? r.logDate : key === 'genset' ? r.designation : (r.derived[key as keyof LogRow['derived']] as number | null);
  const sign = q.dir === 'asc' ? 1 : -1;
  filtered.sort((a, b) => {
    const va = value(a);
    const vb = value(b);
    if (va === vb) return a.logDate < b.logDate ? -sign : a.logDate > b.logDate ? sign : a.designation.localeCompare(b.designation);
    if (va === null) return 1;
    if (vb === null) return -1;
    return (va < vb ? -1 : 1) * sign;
  });
  const start = (q.page - 1) * q.pageSize;
  return { rows: filtered.slice(start, start + q.pageSize), total: filtered.length, page: q.page, pageSize: q.pageSize, missingDays };
}

const round = (v: number | null, digits: number) => (v === null ? null : Number(v.toFixed(digits)));

/** The vessel's logs as CSV: raw values and derived figures with units in the headers; text cells neutralised. */
export async function exportLogs(deps: AppDeps, actor: Actor, vesselId: string, q: { gensetId?: string; from?: string; to?: string }): Promise<{ fileName: string; csv: string }> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  const { rows } = await derivedRows(deps.db, vesselId, q);
  rows.sort((a, b) => (a.logDate < b.logDate ? -1 : a.logDate > b.logDate ? 1 : a.designation.localeCompare(b.designation)));
  const headers = [
    'date', 'genset', 'running_hours_meter_h', 'hours_run_h', 'kwh_meter_kwh', 'kwh_produced_kwh', 'fuel_mass_kg', 'fuel_volume_l', 'fuel_temp_c',
    'fuel_lot', 'remarks', 'derived_hours_run_h', 'derived_kwh', 'avg_load_kw', 'avg_load_pct', 'fuel_kg_at_15c', 'fuel_kg_iso_lcv',
    'sfoc_observed_g_per_kwh', 'sfoc_iso_g_per_kwh', 'co2_kg', 'excluded_from_fit', 'exclude_reason', 'flags',
  ];
  const data = rows.map((r) => [
    r.logDate, r.designation, r.runningHoursMeter, r.hoursRun, r.kwhMeter, r.kwh, r.fuelMassKg, r.fuelVolumeL, r.fuelTempC,
    r.derived.fuelLotReference, r.remarks, round(r.derived.hoursRun, 3), round(r.derived.kwh, 3), round(r.derived.avgLoadKw, 2),
    round(r.derived.avgLoadPct, 2), round(r.derived.fuelKgAt15, 3), round(r.derived.fuelKgIso, 3), round(r.derived.sfocObservedGPerKwh, 2),
    round(r.derived.sfocIsoGPerKwh, 2), round(r.derived.co2Kg, 2), r.excludedFromFit ? 'yes' : 'no', r.excludeReason, r.flags.map((f) => f.code).join(' '),
  ]);
  const safeName = vessel.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'vessel';
  return { fileName: `${safeName}-logs.csv`, csv: writeCsv(headers, data) };
}

async function checkEntry(tx: DbOrTx, vesselId: string, input: ReturnType<typeof logEntryInputSchema.parse>) {
  const [set] = await tx.select().from(gensets).where(and(eq(gensets.id, input.gensetId), eq(gensets.vesselId, vesselId)));
  if (!set) throw new AppError('validation_failed', 'Choose a genset of this vessel', [{ path: 'gensetId', message: 'Not a set of this vessel' }]);
  const ctx = await loadVesselLogContext(tx, vesselId);
  if (input.fuelLotId && !ctx.lotsById.has(input.fuelLotId)) throw new AppError('validation_failed', 'Choose a fuel lot of this vessel', [{ path: 'fuelLotId', message: 'Not a lot of this vessel' }]);
  const { lot } = resolveLot(input, input.logDate, ctx.lotsById, ctx.lotsByDate);
  const issues = rawValueIssues(input, lot);
  if (issues.length) throw new AppError('validation_failed', issues[0].message, issues);
  return set;
}

function entryValues(input: ReturnType<typeof logEntryInputSchema.parse>) {
  const { gensetId, logDate, ...raw } = input;
  return { gensetId, logDate, ...raw };
}

async function logOfVessel(tx: DbOrTx, vesselId: string, logId: string) {
  const [row] = await tx
    .select({ log: gensetDailyLogs })
    .from(gensetDailyLogs)
    .innerJoin(gensets, eq(gensets.id, gensetDailyLogs.gensetId))
    .where(and(eq(gensetDailyLogs.id, logId), eq(gensets.vesselId, vesselId)));
  if (!row) throw notFound('Log entry');
  return row.log;
}

async function oneRow(deps: AppDeps, vesselId: string, logId: string): Promise<LogRow> {
  const log = await logOfVessel(deps.db, vesselId, logId);
  const { rows } = await derivedRows(deps.db, vesselId, { gensetId: log.gensetId, from: log.logDate, to: log.logDate });
  const row = rows.find((r) => r.id === logId);
  if (!row) throw notFound('Log entry');
  return row;
}

const duplicateDay = (designation: string, date: string) =>
  new AppError('conflict', `${designation} has a log for ${date} already; edit that day instead`, [{ path: 'logDate', message: 'A log exists for this set and day' }]);

export async function createLog(deps: AppDeps, actor: Actor, vesselId: string, raw: LogEntryInput): Promise<LogRow> {
  const input = logEntryInputSchema.parse(raw);
  const id = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const set = await checkEntry(tx, vesselId, input);
    const [clash] = await tx.select({ id: gensetDailyLogs.id }).from(gensetDailyLogs).where(and(eq(gensetDailyLogs.gensetId, input.gensetId), eq(gensetDailyLogs.logDate, input.logDate)));
    if (clash) throw duplicateDay(set.designation, input.logDate);
    const [row] = await tx.insert(gensetDailyLogs).values({ ...entryValues(input), source: 'manual' }).returning();
    await recordAudit(tx, actor, 'genset_daily_log', row.id, 'create', null, row);
    return row.id;
  });
  return oneRow(deps, vesselId, id);
}

export async function updateLog(deps: AppDeps, actor: Actor, vesselId: string, logId: string, raw: LogEntryInput): Promise<LogRow> {
  const input = logEntryInputSchema.parse(raw);
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const before = await logOfVessel(tx, vesselId, logId);
    const set = await checkEntry(tx, vesselId, input);
    if (input.gensetId !== before.gensetId || input.logDate !== before.logDate) {
      const [clash] = await tx.select({ id: gensetDailyLogs.id }).from(gensetDailyLogs).where(and(eq(gensetDailyLogs.gensetId, input.gensetId), eq(gensetDailyLogs.logDate, input.logDate)));
      if (clash) throw duplicateDay(set.designation, input.logDate);
    }
    // A hand edit marks the row 'manual' but keeps the import that wrote it: undoing that import is then refused
    // rather than silently dropping the edit.
    const [after] = await tx
      .update(gensetDailyLogs)
      .set({ ...entryValues(input), source: 'manual', updatedAt: deps.now() })
      .where(eq(gensetDailyLogs.id, logId))
      .returning();
    await recordAudit(tx, actor, 'genset_daily_log', logId, 'update', before, after);
  });
  return oneRow(deps, vesselId, logId);
}

export async function deleteLog(deps: AppDeps, actor: Actor, vesselId: string, logId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const before = await logOfVessel(tx, vesselId, logId);
    await tx.delete(gensetDailyLogs).where(eq(gensetDailyLogs.id, logId));
    await recordAudit(tx, actor, 'genset_daily_log', logId, 'delete', before, null);
  });
}

/** Excludes a day from curve fitting with a reason, or includes it again. Raw values are untouched. */
export async function setExclusion(deps: AppDeps, actor: Actor, vesselId: string, logId: string, raw: ExclusionInput): Promise<LogRow> {
  const input = exclusionInputSchema.parse(raw);
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const before = await logOfVessel(tx, vesselId, logId);
    const [after] = await tx
      .update(gensetDailyLogs)
      .set({ excludedFromFit: input.excluded, excludeReason: input.excluded ? input.reason : null, updatedAt: deps.now() })
      .where(eq(gensetDailyLogs.id, logId))
      .returning();
    await recordAudit(tx, actor, 'genset_daily_log', logId, input.excluded ? 'exclude' : 'include', { excludedFromFit: before.excludedFromFit, excludeReason: before.excludeReason }, { excludedFromFit: after.excludedFromFit, excludeReason: after.excludeReason });
  });
  return oneRow(deps, vesselId, logId);
}

// ---------------------------------------------------------------------------------------------------------------
// Meter replacements

export async function listReplacements(deps: AppDeps, actor: Actor, vesselId: string): Promise<MeterReplacementRow[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db
    .select({ r: meterReplacements, designation: gensets.designation })
    .from(meterReplacements)
    .innerJoin(gensets, eq(gensets.id, meterReplacements.gensetId))
    .where(eq(gensets.vesselId, vesselId))
    .orderBy(asc(meterReplacements.replacedOn));
  return rows.map(({ r, designation }) => ({
    id: r.id,
    gensetId: r.gensetId,
    designation,
    meter: r.meter,
    replacedOn: r.replacedOn,
    oldFinalReading: r.oldFinalReading,
    newStartReading: r.newStartReading,
    remarks: r.remarks,
  }));
}

/** Records a meter replacement or rollover on a day; that day's negative-delta flag resolves on the next read. */
export async function createReplacement(deps: AppDeps, actor: Actor, vesselId: string, raw: MeterReplacementInput): Promise<MeterReplacementRow> {
  const input = meterReplacementInputSchema.parse(raw);
  const id = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [set] = await tx.select().from(gensets).where(and(eq(gensets.id, input.gensetId), eq(gensets.vesselId, vesselId)));
    if (!set) throw new AppError('validation_failed', 'Choose a genset of this vessel', [{ path: 'gensetId', message: 'Not a set of this vessel' }]);
    const [clash] = await tx
      .select({ id: meterReplacements.id })
      .from(meterReplacements)
      .where(and(eq(meterReplacements.gensetId, input.gensetId), eq(meterReplacements.meter, input.meter), eq(meterReplacements.replacedOn, input.replacedOn)));
    if (clash) throw new AppError('conflict', `A ${input.meter === 'kwh' ? 'kWh' : 'running-hour'} meter replacement of ${set.designation} on ${input.replacedOn} is recorded already`, [{ path: 'replacedOn', message: 'Recorded already' }]);
    const [row] = await tx.insert(meterReplacements).values(input).returning();
    await recordAudit(tx, actor, 'meter_replacement', row.id, 'create', null, row);
    return row.id;
  });
  const all = await listReplacements(deps, actor, vesselId);
  return all.find((r) => r.id === id) as MeterReplacementRow;
}

export async function deleteReplacement(deps: AppDeps, actor: Actor, vesselId: string, id: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [row] = await tx
      .select({ r: meterReplacements })
      .from(meterReplacements)
      .innerJoin(gensets, eq(gensets.id, meterReplacements.gensetId))
      .where(and(eq(meterReplacements.id, id), eq(gensets.vesselId, vesselId)));
    if (!row) throw notFound('Meter replacement');
    await tx.delete(meterReplacements).where(eq(meterReplacements.id, id));
    await recordAudit(tx, actor, 'meter_replacement', id, 'delete', row.r, null);
  });
}

// ---------------------------------------------------------------------------------------------------------------
// Mode hours

export async function listModeHours(deps: AppDeps, actor: Actor, vesselId: string, q: { from?: string; to?: string }): Promise<ModeHoursRow[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const conds = [eq(vesselModeHours.vesselId, vesselId)];
  if (q.from) conds.push(gte(vesselModeHours.logDate, q.from));
  if (q.to) conds.push(lte(vesselModeHours.logDate, q.to));
  const rows = await deps.db.select().from(vesselModeHours).where(and(...conds)).orderBy(asc(vesselModeHours.logDate));
  return rows.map((r) => ({ logDate: r.logDate, seaH: r.seaH, manoeuvringH: r.manoeuvringH, portH: r.portH, anchorageH: r.anchorageH, shorePowerH: r.shorePowerH }));
}

export async function putModeHours(deps: AppDeps, actor: Actor, vesselId: string, logDate: string, raw: ModeHoursInput): Promise<ModeHoursRow> {
  const values = modeHoursInputSchema.parse(raw);
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(vesselModeHours).where(and(eq(vesselModeHours.vesselId, vesselId), eq(vesselModeHours.logDate, logDate)));
    const [after] = await tx
      .insert(vesselModeHours)
      .values({ vesselId, logDate, ...values })
      .onConflictDoUpdate({ target: [vesselModeHours.vesselId, vesselModeHours.logDate], set: values })
      .returning();
    await recordAudit(tx, actor, 'vessel_mode_hours', `${vesselId}:${logDate}`, before ? 'update' : 'create', before ?? null, after);
    return { logDate: after.logDate, seaH: after.seaH, manoeuvringH: after.manoeuvringH, portH: after.portH, anchorageH: after.anchorageH, shorePowerH: after.shorePowerH };
  });
}

export async function deleteModeHours(deps: AppDeps, actor: Actor, vesselId: string, logDate: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(vesselModeHours).where(and(eq(vesselModeHours.vesselId, vesselId), eq(vesselModeHours.logDate, logDate)));
    if (!before) throw notFound('Mode hours');
    await tx.delete(vesselModeHours).where(and(eq(vesselModeHours.vesselId, vesselId), eq(vesselModeHours.logDate, logDate)));
    await recordAudit(tx, actor, 'vessel_mode_hours', `${vesselId}:${logDate}`, 'delete', before, null);
  });
}
