/**
 * Running hours and overhaul planner: hours since each maintenance kind and the forecast due dates per set (recent
 * usage or a saved voyage plan), the fleet list by due date, work windows, and recording completed work.
 */
import { and, desc, eq, inArray } from 'drizzle-orm';
import { dailyHoursFromPlan, forecastDue, type UsageAssumption } from '../../optimizer/overhaul/forecast';
import { hoursSinceMaintenance } from '../../optimizer/overhaul/running-hours';
import {
  OVERHAUL_CAUTION,
  maintenanceEventInputSchema,
  overhaulQuerySchema,
  workWindowInputSchema,
  type FleetOverhaul,
  type FleetOverhaulRow,
  type MaintenanceDue,
  type MaintenanceEvent,
  type MaintenanceEventInput,
  type OverhaulQuery,
  type SetOverhaul,
  type VesselOverhaul,
  type WorkWindow,
  type WorkWindowInput,
} from '../../shared/schemas/overhaul';
import type { PlanResult } from '../../shared/schemas/plans';
import type { Actor, AppDeps } from '../context';
import { gensetMaintenance, gensets, maintenanceEvents, users, vessels, voyagePlans, workWindows } from '../db/schema';
import { AppError, notFound } from '../errors';
import { parseBody } from '../lib/parse';
import { inScope, vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadSetHours, recentUsage, windowsOfVessel, type SetHours } from './overhaul-data';

type WindowRow = typeof workWindows.$inferSelect;

function windowOut(w: WindowRow): WorkWindow {
  return { id: w.id, vesselId: w.vesselId, kind: w.kind, place: w.place, startsOn: w.startsOn, endsOn: w.endsOn };
}

function windowOn(windows: WorkWindow[], date: string | null): string | null {
  if (!date) return null;
  return windows.find((w) => w.startsOn <= date && date <= w.endsOn)?.id ?? null;
}

function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

interface PlanUsage {
  id: string;
  name: string;
  startDate: string;
  /** Planned hours per genset id and date. */
  byGenset: Record<string, { date: string; hours: number }[]>;
}

async function planUsage(deps: AppDeps, vesselId: string, planId: string, startDate: string): Promise<PlanUsage> {
  const [plan] = await deps.db.select().from(voyagePlans).where(and(eq(voyagePlans.id, planId), eq(voyagePlans.vesselId, vesselId)));
  if (!plan) throw notFound('Voyage plan');
  const result = plan.result as PlanResult | null;
  if (!result || result.status === 'infeasible' || !result.periods.length) {
    throw new AppError('conflict', 'This voyage plan has no solved result to forecast with', [{ path: 'planId', message: 'Choose a solved or approved plan' }]);
  }
  return { id: plan.id, name: plan.name, startDate, byGenset: dailyHoursFromPlan(result.periods, result.periods, startDate) };
}

/**
 * A set's planned hours per date under a voyage plan: the plan's hours on its dates (0 h on a plan date the set does
 * not run), and the recent rate on the days between the latest reading and the plan's start.
 */
function planProfile(set: SetHours, plan: PlanUsage, recentHPerDay: number): { date: string; hours: number }[] {
  const planned = new Map((plan.byGenset[set.id] ?? []).map((p) => [p.date, p.hours]));
  const dates = [...new Set(Object.values(plan.byGenset).flatMap((days) => days.map((d) => d.date)))].sort();
  const out = dates.map((date) => ({ date, hours: Math.min(24, planned.get(date) ?? 0) }));
  const latest = set.record.readings.map((r) => r.date).sort().at(-1);
  if (latest) for (let d = addDays(latest, 1); d < plan.startDate; d = addDays(d, 1)) out.push({ date: d, hours: Math.min(24, recentHPerDay) });
  return out.filter((p) => !latest || p.date > latest);
}

/** The due dates of one set under its usage assumption; the window each falls in. */
function setOverhaul(set: SetHours, q: { windowDays: number }, windows: WorkWindow[], plan: PlanUsage | null): SetOverhaul {
  const rate = recentUsage(set, q.windowDays);
  const profile = plan ? planProfile(set, plan, rate.ok ? rate.hPerDay : 0) : null;
  const usage: SetOverhaul['usage'] = {
    source: plan ? 'plan' : 'recent',
    hPerDay: rate.ok ? rate.hPerDay : null,
    fromDate: rate.ok ? rate.fromDate : null,
    toDate: rate.ok ? rate.toDate : null,
    note: rate.ok ? (rate.shortWindow ? `Readings reach back only to ${rate.fromDate}` : null) : rate.reason,
    planHours: profile ? profile.reduce((s, p) => s + p.hours, 0) : null,
  };
  let assumption: UsageAssumption | null = null;
  if (profile) assumption = { profile, ...(rate.ok ? { afterHPerDay: Math.min(24, Math.max(0, rate.hPerDay)) } : {}) };
  else if (rate.ok) assumption = { hPerDay: Math.min(24, Math.max(0, rate.hPerDay)) };
  const items: MaintenanceDue[] = set.statuses.map((s) => {
    // Without a rate the due by hours is unknown; the calendar due (if any) still stands.
    const f = forecastDue(s, assumption ?? { hPerDay: 0 });
    return {
      kind: s.kind,
      intervalHours: s.intervalHours,
      intervalMonths: s.intervalMonths,
      basis: s.basis,
      lastDoneOn: s.lastDoneOn,
      hoursSince: s.hoursSince,
      hoursLeft: s.hoursLeft,
      dueAtMeterReadingH: s.dueAtMeterReadingH,
      dueByHoursDate: f.dueByHoursDate,
      dueByMonthsDate: f.dueByMonthsDate,
      dueDate: f.dueDate,
      governedBy: f.governedBy,
      daysLeft: f.daysLeft,
      overdue: f.overdue,
      windowId: windowOn(windows, f.dueDate),
    };
  });
  const latest = set.record.readings.reduce<{ date: string; readingH: number } | null>((best, r) => (!best || r.date > best.date ? r : best), null);
  return {
    gensetId: set.id,
    designation: set.designation,
    duty: set.duty,
    asOfDate: set.statuses[0]?.asOfDate ?? latest?.date ?? null,
    latestMeterH: latest?.readingH ?? null,
    usage,
    items,
    problem: set.problem,
  };
}

/** Hours since, hours left and due dates of every maintenance kind of every set of a vessel, with its windows. */
export async function getVesselOverhaul(deps: AppDeps, actor: Actor, vesselId: string, rawQuery: OverhaulQuery | unknown): Promise<VesselOverhaul> {
  const q = parseBody(overhaulQuerySchema, rawQuery, 'query');
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  const [sets, windowRows] = await Promise.all([loadSetHours(deps.db, vesselId), windowsOfVessel(deps.db, vesselId)]);
  const windows = windowRows.map(windowOut);
  let plan: PlanUsage | null = null;
  if (q.usage === 'plan' && q.planId) {
    const latest = sets.flatMap((s) => s.record.readings.map((r) => r.date)).sort().at(-1);
    const start = q.planStartDate ?? (latest ? addDays(latest, 1) : deps.now().toISOString().slice(0, 10));
    plan = await planUsage(deps, vesselId, q.planId, start);
  }
  return {
    vesselId,
    vesselName: vessel.name,
    usage: q.usage,
    windowDays: q.windowDays,
    planId: plan?.id ?? null,
    planName: plan?.name ?? null,
    planStartDate: plan?.startDate ?? null,
    sets: sets.map((s) => setOverhaul(s, q, windows, plan)),
    windows,
    caution: OVERHAUL_CAUTION,
  };
}

function byDue(a: FleetOverhaulRow, b: FleetOverhaulRow): number {
  if (a.dueDate !== b.dueDate) return a.dueDate === null ? 1 : b.dueDate === null ? -1 : a.dueDate < b.dueDate ? -1 : 1;
  return a.hoursLeft - b.hoursLeft;
}

/** Every maintenance kind of every set of every vessel the actor sees, by due date at recent usage. */
export async function getFleetOverhaul(deps: AppDeps, actor: Actor, rawQuery: OverhaulQuery | unknown): Promise<FleetOverhaul> {
  const q = parseBody(overhaulQuerySchema, { ...(rawQuery as object), usage: 'recent', planId: undefined }, 'query');
  const list = (await deps.db.select({ id: vessels.id, name: vessels.name }).from(vessels).where(eq(vessels.companyId, actor.companyId))).filter((v) =>
    inScope(actor, v.id),
  );
  const rows: FleetOverhaulRow[] = [];
  const problems: FleetOverhaul['problems'] = [];
  for (const v of list) {
    const [sets, windowRows] = await Promise.all([loadSetHours(deps.db, v.id), windowsOfVessel(deps.db, v.id)]);
    const windows = windowRows.map(windowOut);
    for (const s of sets) {
      const o = setOverhaul(s, q, windows, null);
      if (o.problem) problems.push({ vesselId: v.id, vesselName: v.name, gensetId: s.id, designation: s.designation, problem: o.problem });
      for (const item of o.items) {
        rows.push({ ...item, vesselId: v.id, vesselName: v.name, gensetId: s.id, designation: s.designation, asOfDate: o.asOfDate, usageHPerDay: o.usage.hPerDay });
      }
    }
  }
  rows.sort(byDue);
  return { windowDays: q.windowDays, rows, problems, caution: OVERHAUL_CAUTION };
}

// ---------------------------------------------------------------------------------------------------------------
// Work windows

export async function listWorkWindows(deps: AppDeps, actor: Actor, vesselId: string): Promise<WorkWindow[]> {
  await vesselForActor(deps.db, actor, vesselId);
  return (await windowsOfVessel(deps.db, vesselId)).map(windowOut);
}

export async function createWorkWindow(deps: AppDeps, actor: Actor, vesselId: string, raw: WorkWindowInput): Promise<WorkWindow> {
  const input = parseBody(workWindowInputSchema, raw, 'work window');
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [row] = await tx.insert(workWindows).values({ vesselId, ...input }).returning();
    await recordAudit(tx, actor, 'work_window', row.id, 'create', null, row);
    return windowOut(row);
  });
}

export async function updateWorkWindow(deps: AppDeps, actor: Actor, vesselId: string, windowId: string, raw: WorkWindowInput): Promise<WorkWindow> {
  const input = parseBody(workWindowInputSchema, raw, 'work window');
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(workWindows).where(and(eq(workWindows.id, windowId), eq(workWindows.vesselId, vesselId)));
    if (!before) throw notFound('Work window');
    const [row] = await tx.update(workWindows).set(input).where(eq(workWindows.id, windowId)).returning();
    await recordAudit(tx, actor, 'work_window', row.id, 'update', before, row);
    return windowOut(row);
  });
}

export async function deleteWorkWindow(deps: AppDeps, actor: Actor, vesselId: string, windowId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [row] = await tx.delete(workWindows).where(and(eq(workWindows.id, windowId), eq(workWindows.vesselId, vesselId))).returning();
    if (!row) throw notFound('Work window');
    await recordAudit(tx, actor, 'work_window', row.id, 'delete', row, null);
  });
}

// ---------------------------------------------------------------------------------------------------------------
// Completed work

export async function listMaintenanceEvents(deps: AppDeps, actor: Actor, vesselId: string): Promise<MaintenanceEvent[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db
    .select({ e: maintenanceEvents, designation: gensets.designation, by: users.name })
    .from(maintenanceEvents)
    .innerJoin(gensets, eq(gensets.id, maintenanceEvents.gensetId))
    .leftJoin(users, eq(users.id, maintenanceEvents.recordedBy))
    .where(eq(gensets.vesselId, vesselId))
    .orderBy(desc(maintenanceEvents.doneOn), desc(maintenanceEvents.createdAt));
  return rows.map(({ e, designation, by }) => ({
    id: e.id,
    gensetId: e.gensetId,
    designation,
    kind: e.kind,
    doneOn: e.doneOn,
    runningHours: e.runningHours,
    remarks: e.remarks,
    recordedBy: by ?? null,
    createdAt: e.createdAt.toISOString(),
  }));
}

/**
 * Records completed work on a set: it resets that kind's interval from its date and meter reading, and (for an
 * overhaul kind) the curves service starts a new post-overhaul window from it. The reading must fit the set's
 * logged meter readings and meter replacements (the same check the count makes).
 */
export async function recordMaintenanceEvent(deps: AppDeps, actor: Actor, vesselId: string, raw: MaintenanceEventInput): Promise<MaintenanceEvent> {
  const input = parseBody(maintenanceEventInputSchema, raw, 'completed work');
  const id = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    if (input.doneOn > deps.now().toISOString().slice(0, 10)) {
      throw new AppError('validation_failed', 'Completed work cannot be dated in the future', [{ path: 'doneOn', message: 'Enter the date the work was done' }]);
    }
    const [set] = await tx.select().from(gensets).where(and(eq(gensets.id, input.gensetId), eq(gensets.vesselId, vesselId)));
    if (!set) throw new AppError('validation_failed', 'That set is not on this vessel', [{ path: 'gensetId', message: 'Not a set of this vessel' }]);
    const kinds = await tx.select().from(gensetMaintenance).where(inArray(gensetMaintenance.gensetId, [set.id]));
    const kind = kinds.find((k) => k.kind.toLowerCase() === input.kind.toLowerCase())?.kind ?? input.kind;
    const [hours] = await loadSetHours(tx, vesselId, [set.id]);
    const record = hours.record;
    if (record.readings.length) {
      try {
        hoursSinceMaintenance(
          { ...record, kinds: [{ kind, intervalHours: 1 }], done: [...(record.done ?? []).filter((d) => d.kind !== kind), { kind, doneOn: input.doneOn, readingH: input.runningHours }] },
          { asOfDate: record.readings.some((r) => r.date >= input.doneOn) ? undefined : input.doneOn },
        );
      } catch (err) {
        const message = err instanceof Error ? err.message.replace(/^hoursSinceMaintenance:?\s*/, '') : String(err);
        throw new AppError('validation_failed', `The meter reading does not fit the logs: ${message}`, [{ path: 'runningHours', message }]);
      }
    }
    const [row] = await tx
      .insert(maintenanceEvents)
      .values({ gensetId: set.id, kind, doneOn: input.doneOn, runningHours: input.runningHours, remarks: input.remarks ?? null, recordedBy: actor.userId })
      .returning();
    await recordAudit(tx, actor, 'maintenance_event', row.id, 'create', null, row);
    return row.id;
  });
  const all = await listMaintenanceEvents(deps, actor, vesselId);
  return all.find((e) => e.id === id) as MaintenanceEvent;
}
