/**
 * Voyage plans: stored inputs (profile, plant, rules, budgets, thresholds) so a plan can be solved again, the
 * solve in a worker thread with progress in voyage_plans.progress, approval by a superintendent, and a load
 * profile built from the vessel's logged history.
 */
import { and, desc, eq, inArray, max } from 'drizzle-orm';
import type { HistoryProfile, HistoryProfileInput, PlanDetail, PlanInput, PlanResult, PlanSummary, ProfilePeriod } from '../../shared/schemas/plans';
import { historyProfileInputSchema, planInputSchema } from '../../shared/schemas/plans';
import { OPERATING_MODES, RECOMMENDATION_CAUTION, type OperatingModeName, type OperatingRuleInput } from '../../shared/schemas/recommendations';
import type { Actor, AppDeps } from '../context';
import { gensetDailyLogs, gensetMaintenance, hourBudgetPlans, maintenanceEvents, users, vesselModeHours, voyagePlans } from '../db/schema';
import { AppError, notFound } from '../errors';
import { enqueuePlan, isQueued } from '../workers/plan-runner';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadCurveInputs } from './curve-inputs';
import { buildPlantModel } from './plant-model';
import type { StoredPlanInputs } from './plans-solve';
import { rulesOfVessel } from './recommendations';

type PlanRow = typeof voyagePlans.$inferSelect;
const PROGRESS_WRITE_MS = 250;

/** Approved overhaul budgets (hour_budget_plans), pro rata to the plan's horizon when it is shorter. */
async function approvedBudgets(deps: AppDeps, vesselId: string, horizonH: number): Promise<Record<string, number> | null> {
  const [row] = await deps.db
    .select()
    .from(hourBudgetPlans)
    .where(and(eq(hourBudgetPlans.vesselId, vesselId), eq(hourBudgetPlans.status, 'approved')))
    .orderBy(desc(hourBudgetPlans.approvedAt), desc(hourBudgetPlans.createdAt))
    .limit(1);
  const result = row?.result as { hourBudgets?: Record<string, number>; horizonDays?: number } | undefined;
  if (!result?.hourBudgets) return null;
  const spanH = (result.horizonDays ?? 0) * 24;
  const scale = spanH > horizonH ? horizonH / spanH : 1;
  const out: Record<string, number> = {};
  for (const [id, h] of Object.entries(result.hourBudgets)) if (typeof h === 'number' && h >= 0) out[id] = h * scale;
  return out;
}

/**
 * Hours left to each maintenance kind now: last done (the later of the register's figure and the latest recorded
 * event of that kind) + interval − latest hour-meter reading; null when either reading is unknown.
 */
async function maintenanceAtStart(deps: AppDeps, gensetIds: string[]): Promise<StoredPlanInputs['maintenance']> {
  if (!gensetIds.length) return [];
  const kinds = await deps.db.select().from(gensetMaintenance).where(inArray(gensetMaintenance.gensetId, gensetIds));
  const meters = await deps.db
    .select({ gensetId: gensetDailyLogs.gensetId, hours: max(gensetDailyLogs.runningHoursMeter) })
    .from(gensetDailyLogs)
    .where(inArray(gensetDailyLogs.gensetId, gensetIds))
    .groupBy(gensetDailyLogs.gensetId);
  const events = await deps.db.select().from(maintenanceEvents).where(inArray(maintenanceEvents.gensetId, gensetIds));
  const meterBy = new Map(meters.map((m) => [m.gensetId, m.hours]));
  return kinds.map((k) => {
    const evs = events.filter((e) => e.gensetId === k.gensetId && e.kind.toLowerCase() === k.kind.toLowerCase()).map((e) => e.runningHours);
    const done = [k.lastDoneRunningHours, ...evs].filter((x): x is number => typeof x === 'number');
    const last = done.length ? Math.max(...done) : null;
    const meter = meterBy.get(k.gensetId) ?? null;
    return { gensetId: k.gensetId, kind: k.kind, intervalHours: k.intervalHours, hoursLeftAtStartH: last === null || meter === null ? null : last + k.intervalHours - meter };
  });
}

async function namesOf(deps: AppDeps, ids: (string | null)[]): Promise<Map<string, string>> {
  const list = [...new Set(ids.filter((x): x is string => !!x))];
  if (!list.length) return new Map();
  const rows = await deps.db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, list));
  return new Map(rows.map((r) => [r.id, r.name]));
}

function summaryOf(row: PlanRow, names: Map<string, string>): PlanSummary {
  const inputs = row.inputs as StoredPlanInputs;
  const result = row.result as PlanResult | null;
  return {
    id: row.id,
    vesselId: row.vesselId,
    name: row.name,
    status: row.status,
    progress: row.progress,
    horizonH: inputs.profile.reduce((s, p) => s + p.durationH, 0),
    periods: inputs.profile.length,
    totalFuelKg: result && result.status !== 'infeasible' ? result.totalFuelKg : null,
    savingFuelKg: result?.savingFuelKg ?? null,
    statusText: result?.statusText ?? null,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdBy ? (names.get(row.createdBy) ?? null) : null,
    approvedAt: row.approvedAt?.toISOString() ?? null,
    approvedBy: row.approvedBy ? (names.get(row.approvedBy) ?? null) : null,
    resolvedFrom: inputs.resolvedFrom,
  };
}

function detailOf(row: PlanRow, names: Map<string, string>): PlanDetail {
  const inputs = row.inputs as StoredPlanInputs;
  return {
    ...summaryOf(row, names),
    error: row.error,
    units: inputs.units,
    rules: inputs.rules,
    budgetSource: inputs.budgetSource,
    pmsThresholds: inputs.pmsThresholds,
    profile: inputs.profile,
    result: (row.result as PlanResult | null) ?? null,
    caution: RECOMMENDATION_CAUTION,
  };
}

/** Starts (or restarts after a server restart) the solve of a queued or solving plan. */
function startSolve(deps: AppDeps, planId: string, inputs: StoredPlanInputs): void {
  let lastWrite = 0;
  const set = (values: Partial<typeof voyagePlans.$inferInsert>) =>
    deps.db.update(voyagePlans).set({ ...values, updatedAt: deps.now() }).where(eq(voyagePlans.id, planId));
  enqueuePlan(planId, inputs, {
    onStart: async () => {
      await set({ status: 'solving', progress: 0, error: null });
    },
    onProgress: (fraction) => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      set({ progress: Math.min(0.99, fraction) }).catch(() => undefined);
    },
    onDone: async ({ result, solveMs }) => {
      await set({ status: 'solved', progress: 1, result: { ...result, solveMs }, error: null });
    },
    onError: async (message) => {
      await set({ status: 'failed', error: message });
    },
  });
}

async function planRow(deps: AppDeps, actor: Actor, vesselId: string, planId: string): Promise<PlanRow> {
  await vesselForActor(deps.db, actor, vesselId);
  const [row] = await deps.db.select().from(voyagePlans).where(and(eq(voyagePlans.id, planId), eq(voyagePlans.vesselId, vesselId)));
  if (!row) throw notFound('Plan');
  return row;
}

async function insertPlan(deps: AppDeps, actor: Actor, vesselId: string, name: string, inputs: StoredPlanInputs): Promise<PlanDetail> {
  const row = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [created] = await tx
      .insert(voyagePlans)
      .values({ vesselId, name, status: 'queued', progress: 0, inputs, createdBy: actor.userId, createdAt: deps.now(), updatedAt: deps.now() })
      .returning();
    await recordAudit(tx, actor, 'voyage_plan', created.id, 'create', null, {
      vesselId,
      name,
      periods: inputs.profile.length,
      budgetSource: inputs.budgetSource,
      resolvedFrom: inputs.resolvedFrom,
    });
    return created;
  });
  startSolve(deps, row.id, inputs);
  return detailOf(row, await namesOf(deps, [row.createdBy]));
}

/** Stores a plan's inputs (plant, rules, budgets and thresholds as of now) and queues its solve. */
export async function createPlan(deps: AppDeps, actor: Actor, vesselId: string, raw: PlanInput): Promise<PlanDetail> {
  const input = planInputSchema.parse(raw);
  const plant = await buildPlantModel(deps, actor, vesselId);
  if (!plant.model.units.length) {
    throw new AppError('validation_failed', 'The vessel has no service set with a fuel curve (fit or shop test)', [{ path: 'periods', message: 'No sets to plan' }]);
  }
  const ruleList = await rulesOfVessel(deps.db, vesselId);
  const rules = Object.fromEntries(
    ruleList.map((r) => [r.mode, { marginKw: r.marginKw, marginPct: r.marginPct, minSets: r.minSets, nMinus1: r.nMinus1, busTieClosed: r.busTieClosed }]),
  ) as Record<OperatingModeName, OperatingRuleInput>;
  const sections = new Set(plant.model.units.map((u) => u.busSection));
  input.periods.forEach((p, i) => {
    for (const k of Object.keys(p.sectionLoadsKw ?? {})) {
      if (!sections.has(k)) throw new AppError('validation_failed', `Period ${i + 1}: unknown bus section ${k}`, [{ path: `periods.${i}.sectionLoadsKw`, message: 'Unknown bus section', row: i + 1 }]);
    }
  });
  const ids = new Set(plant.model.units.map((u) => u.gensetId));
  for (const id of Object.keys(input.hourBudgetsH ?? {})) {
    if (!ids.has(id)) throw new AppError('validation_failed', 'A running-hour budget names a set that is not in the plan', [{ path: `hourBudgetsH.${id}`, message: 'Not a service set of this vessel' }]);
  }
  const horizonH = input.periods.reduce((s, p) => s + p.durationH, 0);
  const approved = input.hourBudgetsH ? null : await approvedBudgets(deps, vesselId, horizonH);
  const inputs: StoredPlanInputs = {
    version: 1,
    profileSource: input.profileSource,
    profile: input.periods,
    units: plant.model.units,
    rules,
    hourBudgetsH: input.hourBudgetsH ?? approved ?? {},
    budgetSource: input.hourBudgetsH ? 'typed' : approved ? 'approved_overhaul_plan' : 'none',
    pmsThresholds: { startAbovePct: plant.vessel.pmsStartAbovePct, stopBelowPct: plant.vessel.pmsStopBelowPct },
    fuelGrade: plant.vessel.fuelGrades[0] ?? 'MGO',
    maintenance: await maintenanceAtStart(deps, [...ids]),
    resolvedFrom: null,
  };
  return insertPlan(deps, actor, vesselId, input.name, inputs);
}

/** A new plan from the stored inputs of another: the re-solve gives the same result. */
export async function resolvePlan(deps: AppDeps, actor: Actor, vesselId: string, planId: string): Promise<PlanDetail> {
  const row = await planRow(deps, actor, vesselId, planId);
  const inputs = { ...(row.inputs as StoredPlanInputs), resolvedFrom: row.id };
  return insertPlan(deps, actor, vesselId, `${row.name} (re-solved)`, inputs);
}

export async function listPlans(deps: AppDeps, actor: Actor, vesselId: string): Promise<PlanSummary[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db.select().from(voyagePlans).where(eq(voyagePlans.vesselId, vesselId)).orderBy(desc(voyagePlans.createdAt)).limit(200);
  const names = await namesOf(deps, rows.flatMap((r) => [r.createdBy, r.approvedBy]));
  return rows.map((r) => summaryOf(r, names));
}

export async function getPlan(deps: AppDeps, actor: Actor, vesselId: string, planId: string): Promise<PlanDetail> {
  const row = await planRow(deps, actor, vesselId, planId);
  // A plan left queued or solving by a stopped server process is solved again here.
  if ((row.status === 'queued' || row.status === 'solving') && !isQueued(row.id)) startSolve(deps, row.id, row.inputs as StoredPlanInputs);
  return detailOf(row, await namesOf(deps, [row.createdBy, row.approvedBy]));
}

export async function approvePlan(deps: AppDeps, actor: Actor, vesselId: string, planId: string): Promise<PlanDetail> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [row] = await tx.select().from(voyagePlans).where(and(eq(voyagePlans.id, planId), eq(voyagePlans.vesselId, vesselId))).for('update');
    if (!row) throw notFound('Plan');
    const result = row.result as PlanResult | null;
    if (row.status === 'approved') throw new AppError('conflict', 'The plan is approved already');
    if (row.status !== 'solved' || !result || result.status === 'infeasible') {
      throw new AppError('conflict', 'Only a solved, feasible plan can be approved', [{ path: 'status', message: `Plan is ${row.status}` }]);
    }
    const at = deps.now();
    await tx.update(voyagePlans).set({ status: 'approved', approvedBy: actor.userId, approvedAt: at, updatedAt: at }).where(eq(voyagePlans.id, planId));
    await recordAudit(tx, actor, 'voyage_plan', planId, 'approve', { status: row.status }, { status: 'approved', approvedAt: at.toISOString() });
  });
  return getPlan(deps, actor, vesselId, planId);
}

/**
 * A load profile from logged history: the average load of each mode over the window, from days spent (at least
 * 80 % of the hours not on shore power) in that mode, load = Σ sets' kWh / those hours; then the sequence of legs
 * cut into periods of `periodH` hours.
 */
export async function historyProfile(deps: AppDeps, actor: Actor, vesselId: string, raw: HistoryProfileInput): Promise<HistoryProfile> {
  const input = historyProfileInputSchema.parse(raw);
  await vesselForActor(deps.db, actor, vesselId);
  const sets = (await loadCurveInputs(deps.db, vesselId)).filter((s) => s.duty === 'service');
  const modeRows = await deps.db.select().from(vesselModeHours).where(eq(vesselModeHours.vesselId, vesselId));
  const kwhByDate = new Map<string, number>();
  for (const s of sets) {
    for (const d of s.days) {
      if (d.date < input.from || d.date > input.to || d.hoursRun === null || d.avgLoadKw === null) continue;
      kwhByDate.set(d.date, (kwhByDate.get(d.date) ?? 0) + d.hoursRun * d.avgLoadKw);
    }
  }
  const sums: Record<OperatingModeName, { kwh: number; h: number; days: number }> = {
    sea: { kwh: 0, h: 0, days: 0 },
    manoeuvring: { kwh: 0, h: 0, days: 0 },
    port: { kwh: 0, h: 0, days: 0 },
    anchorage: { kwh: 0, h: 0, days: 0 },
  };
  for (const m of modeRows) {
    if (m.logDate < input.from || m.logDate > input.to) continue;
    const kwh = kwhByDate.get(m.logDate);
    if (kwh === undefined) continue;
    const hours: Record<OperatingModeName, number> = { sea: m.seaH, manoeuvring: m.manoeuvringH, port: m.portH, anchorage: m.anchorageH };
    const onBoard = OPERATING_MODES.reduce((s, k) => s + hours[k], 0);
    if (!(onBoard > 0)) continue;
    const main = OPERATING_MODES.find((k) => hours[k] >= 0.8 * onBoard);
    if (!main) continue;
    sums[main].kwh += kwh;
    sums[main].h += onBoard;
    sums[main].days += 1;
  }
  const modeLoads = OPERATING_MODES.map((mode) => ({ mode, loadKw: sums[mode].h > 0 ? sums[mode].kwh / sums[mode].h : null, days: sums[mode].days }));
  const warnings: string[] = [];
  const periods: ProfilePeriod[] = [];
  for (const leg of input.sequence) {
    const load = modeLoads.find((m) => m.mode === leg.mode)!.loadKw;
    if (load === null) {
      warnings.push(`no logged day in ${leg.mode} between ${input.from} and ${input.to}: enter that leg's load by hand`);
      continue;
    }
    let left = leg.hours;
    while (left > 1e-9) {
      const d = Math.min(input.periodH, left);
      periods.push({ durationH: d, mode: leg.mode, loadKw: Math.round(load * 10) / 10 });
      left -= d;
    }
  }
  return { periods, modeLoads, warnings };
}
