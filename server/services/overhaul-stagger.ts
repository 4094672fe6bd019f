/**
 * Stagger advice: hour budgets per set until a date so the due dates spread by a minimum gap and land in work
 * windows (optimizer/overhaul proposeHourBudgets), priced with the company's fuel price; saved as a proposed
 * hour_budget_plans row and approved by a planner or superintendent. The voyage-plan service reads
 * `result.hourBudgets` and `result.horizonDays` of the latest approved row as its running-hour limits.
 */
import { and, desc, eq, inArray, lte } from 'drizzle-orm';
import { dayNumber } from '../../optimizer/index';
import { highsSolver } from '../../optimizer/overhaul/linear-model';
import { proposeHourBudgets, type StaggerSet } from '../../optimizer/overhaul/stagger';
import { loadHighs } from '../../optimizer/highs';
import {
  OVERHAUL_CAUTION,
  WORK_WINDOW_LABELS,
  staggerInputSchema,
  type HourBudgetPlan,
  type StaggerRequest,
  type StaggerResult,
} from '../../shared/schemas/overhaul';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { fuelPrices, hourBudgetPlans, users } from '../db/schema';
import { AppError, notFound } from '../errors';
import { parseBody } from '../lib/parse';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadCurveInputs } from './curve-inputs';

/** Per MILP solve of a stagger proposal (a proposal makes one to three solves). */
const STAGGER_SOLVE_LIMIT_MS = 4000;
let highsInstance: ReturnType<typeof loadHighs> | null = null;
import { loadSetHours, recentUsage, windowsOfVessel } from './overhaul-data';

/** Days of a set's latest logs its fuel rate per running hour is taken over. */
const FUEL_RATE_DAYS = 90;

type Parsed = ReturnType<typeof staggerInputSchema.parse>;

/**
 * Fuel per running hour of a set: logged ISO-corrected fuel / hours run over its last 90 days of usable logs;
 * without logs, the shop-test SFOC at 75 % load (common practice as a usual load) × 0.75 × rating.
 */
async function fuelRates(db: DbOrTx, vesselId: string): Promise<Map<string, { kgPerH: number | null; source: string }>> {
  const inputs = await loadCurveInputs(db, vesselId);
  const out = new Map<string, { kgPerH: number | null; source: string }>();
  for (const s of inputs) {
    const last = s.days.at(-1)?.date;
    const from = last ? dayNumber(last) - FUEL_RATE_DAYS : 0;
    let fuel = 0;
    let hours = 0;
    for (const d of s.days) {
      if (!d.usable || d.excluded || d.hoursRun === null || d.fuelKgIso === null || dayNumber(d.date) <= from) continue;
      fuel += d.fuelKgIso;
      hours += d.hoursRun;
    }
    if (hours > 0) out.set(s.id, { kgPerH: fuel / hours, source: 'logs' });
    else {
      const sfoc = s.shopTestSfoc.p75 ?? s.shopTestSfoc.p85 ?? s.shopTestSfoc.p50 ?? s.shopTestSfoc.p100;
      out.set(s.id, sfoc === null ? { kgPerH: null, source: 'none' } : { kgPerH: (sfoc * 0.75 * s.ratedKw) / 1000, source: 'shop test' });
    }
  }
  return out;
}

async function priceOf(db: DbOrTx, companyId: string, grade: string | null, onDate: string): Promise<number | null> {
  if (!grade) return null;
  const [row] = await db
    .select()
    .from(fuelPrices)
    .where(and(eq(fuelPrices.companyId, companyId), eq(fuelPrices.grade, grade), lte(fuelPrices.validFrom, onDate)))
    .orderBy(desc(fuelPrices.validFrom))
    .limit(1);
  return row?.pricePerT ?? null;
}

/** Computes a stagger proposal for a vessel (nothing stored). */
async function computeStagger(deps: AppDeps, actor: Actor, vesselId: string, input: Parsed): Promise<StaggerResult> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  const [sets, windowRows, rates] = await Promise.all([loadSetHours(deps.db, vesselId), windowsOfVessel(deps.db, vesselId), fuelRates(deps.db, vesselId)]);
  if (input.gensetIds) {
    const known = new Set(sets.map((s) => s.id));
    const unknown = input.gensetIds.find((id) => !known.has(id));
    if (unknown) throw new AppError('validation_failed', 'A chosen set is not on this vessel', [{ path: 'gensetIds', message: `${unknown} is not a set of this vessel` }]);
  }
  const leftOut: StaggerResult['leftOut'] = [];
  const chosen: { id: string; designation: string; kind: string; hoursLeftH: number; asOfDate: string; usageHPerDay: number; fuelKgPerH: number }[] = [];
  for (const s of sets) {
    if (input.gensetIds ? !input.gensetIds.includes(s.id) : s.duty !== 'service') {
      if (!input.gensetIds) leftOut.push({ gensetId: s.id, designation: s.designation, reason: 'emergency set' });
      continue;
    }
    if (s.problem) {
      leftOut.push({ gensetId: s.id, designation: s.designation, reason: s.problem });
      continue;
    }
    if (!s.statuses.length) {
      leftOut.push({ gensetId: s.id, designation: s.designation, reason: 'no maintenance kind with an interval in the register' });
      continue;
    }
    const fuel = rates.get(s.id);
    if (!fuel?.kgPerH) {
      leftOut.push({ gensetId: s.id, designation: s.designation, reason: 'no fuel figure (no usable logs and no shop-test SFOC)' });
      continue;
    }
    const next = s.statuses.reduce((a, b) => (b.hoursLeft < a.hoursLeft ? b : a));
    const rate = recentUsage(s, input.windowDays);
    chosen.push({
      id: s.id,
      designation: s.designation,
      kind: next.kind,
      hoursLeftH: next.hoursLeft,
      asOfDate: next.asOfDate,
      usageHPerDay: rate.ok ? Math.min(24, Math.max(0, rate.hPerDay)) : 0,
      fuelKgPerH: fuel.kgPerH,
    });
  }
  if (!chosen.length) {
    throw new AppError('validation_failed', 'No set can be staggered: each needs hour-meter readings, a maintenance interval and a fuel figure', leftOut.map((l) => ({ path: 'gensetIds', message: `${l.designation}: ${l.reason}` })));
  }
  // One start date for all: the latest reading of any chosen set; a set read earlier ran its recent rate since.
  const fromDate = chosen.map((c) => c.asOfDate).sort().at(-1) as string;
  if (input.untilDate <= fromDate) {
    throw new AppError('validation_failed', `Choose a date after the latest readings (${fromDate})`, [{ path: 'untilDate', message: `Must be after ${fromDate}` }]);
  }
  const horizonDays = dayNumber(input.untilDate) - dayNumber(fromDate);
  const staggerSets: StaggerSet[] = chosen.map((c) => {
    const hoursLeftH = c.hoursLeftH - c.usageHPerDay * (dayNumber(fromDate) - dayNumber(c.asOfDate));
    return {
      gensetId: c.id,
      kind: c.kind,
      hoursLeftH,
      usageHPerDay: c.usageHPerDay,
      fuelKgPerH: c.fuelKgPerH,
      maxHPerDay: input.maxHPerDay,
      // A set that cannot reach its due by the date even at its most hours may stay short of it.
      mayFallDueAfterDate: input.allowDueAfterDate || hoursLeftH > input.maxHPerDay * horizonDays,
    };
  });
  const requiredSetHoursPerDay = input.requiredSetHoursPerDay ?? chosen.reduce((s, c) => s + c.usageHPerDay, 0);
  const labels = new Map(windowRows.map((w) => [w.id, `${WORK_WINDOW_LABELS[w.kind]} ${w.place} (${w.startsOn} to ${w.endsOn})`]));
  // HiGHS enforces its time limit inside the solver, so an awkward horizon cannot hold the server for minutes.
  const highs = await (highsInstance ??= loadHighs());
  const proposal = proposeHourBudgets({
    fromDate,
    untilDate: input.untilDate,
    sets: staggerSets,
    windows: windowRows.map((w) => ({ id: w.id, startsOn: w.startsOn, endsOn: w.endsOn, label: `${WORK_WINDOW_LABELS[w.kind]} ${w.place}` })),
    minGapDays: input.minGapDays,
    requiredSetHoursPerDay,
  }, { solve: highsSolver(highs, STAGGER_SOLVE_LIMIT_MS) });
  const byId = new Map(chosen.map((c) => [c.id, c]));
  const nameOf = (text: string) => chosen.reduce((t, c) => t.split(c.id).join(c.designation), text);
  const grade = vessel.fuelGrades[0] ?? null;
  const pricePerT = await priceOf(deps.db, actor.companyId, grade, fromDate);
  return {
    status: proposal.status,
    reasons: proposal.reasons.map(nameOf),
    fromDate,
    untilDate: input.untilDate,
    horizonDays: proposal.horizonDays,
    minGapDays: input.minGapDays,
    requiredSetHoursPerDay,
    budgets: proposal.budgets.map((b) => {
      const c = byId.get(b.gensetId)!;
      return {
        gensetId: b.gensetId,
        designation: c.designation,
        kind: b.kind,
        hoursLeftH: staggerSets.find((s) => s.gensetId === b.gensetId)!.hoursLeftH,
        budgetH: b.budgetH,
        hPerDay: b.hPerDay,
        dueDate: b.dueDate,
        windowId: b.windowId,
        windowLabel: b.windowId ? (labels.get(b.windowId) ?? null) : b.nearestWindowId ? `near ${labels.get(b.nearestWindowId) ?? ''}` : null,
        daysFromWindow: b.daysFromWindow,
        baselineBudgetH: b.baselineBudgetH,
        fuelKgPerH: c.fuelKgPerH,
        fuelKg: b.fuelKg,
        baselineFuelKg: b.baselineFuelKg,
      };
    }),
    hourBudgets: proposal.hourBudgets,
    totalDaysFromWindows: proposal.totalDaysFromWindows,
    fuelKg: proposal.fuelKg,
    baselineFuelKg: proposal.baselineFuelKg,
    fuelDeltaKg: proposal.fuelDeltaKg,
    fuelGrade: grade,
    pricePerT,
    currency: actor.currency,
    costDelta: pricePerT === null ? null : (proposal.fuelDeltaKg / 1000) * pricePerT,
    leftOut,
    caution: OVERHAUL_CAUTION,
  };
}

/** A stagger proposal for a date and gap, not stored (the planner tries dates and gaps before saving one). */
export async function previewStagger(deps: AppDeps, actor: Actor, vesselId: string, raw: StaggerRequest): Promise<StaggerResult> {
  return computeStagger(deps, actor, vesselId, parseBody(staggerInputSchema, raw, 'stagger request'));
}

type BudgetRow = typeof hourBudgetPlans.$inferSelect;

async function budgetPlansOut(deps: AppDeps, rows: BudgetRow[]): Promise<HourBudgetPlan[]> {
  const ids = [...new Set(rows.flatMap((r) => [r.createdBy, r.approvedBy]).filter((x): x is string => !!x))];
  const names = ids.length ? new Map((await deps.db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids))).map((u) => [u.id, u.name])) : new Map<string, string>();
  return rows.map((r) => ({
    id: r.id,
    vesselId: r.vesselId,
    untilDate: r.untilDate,
    status: r.status,
    inputs: r.inputs as HourBudgetPlan['inputs'],
    result: r.result as StaggerResult,
    createdAt: r.createdAt.toISOString(),
    createdBy: r.createdBy ? (names.get(r.createdBy) ?? null) : null,
    approvedAt: r.approvedAt?.toISOString() ?? null,
    approvedBy: r.approvedBy ? (names.get(r.approvedBy) ?? null) : null,
  }));
}

export async function listHourBudgetPlans(deps: AppDeps, actor: Actor, vesselId: string): Promise<HourBudgetPlan[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db.select().from(hourBudgetPlans).where(eq(hourBudgetPlans.vesselId, vesselId)).orderBy(desc(hourBudgetPlans.createdAt));
  return budgetPlansOut(deps, rows);
}

/** Computes a proposal and stores it as a proposed hour-budget plan. */
export async function saveHourBudgetPlan(deps: AppDeps, actor: Actor, vesselId: string, raw: StaggerRequest): Promise<HourBudgetPlan> {
  const input = parseBody(staggerInputSchema, raw, 'stagger request');
  const result = await computeStagger(deps, actor, vesselId, input);
  const row = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [r] = await tx
      .insert(hourBudgetPlans)
      .values({ vesselId, untilDate: input.untilDate, inputs: input, result, status: 'proposed', createdBy: actor.userId, createdAt: deps.now() })
      .returning();
    await recordAudit(tx, actor, 'hour_budget_plan', r.id, 'create', null, { id: r.id, untilDate: r.untilDate, status: r.status, hourBudgets: result.hourBudgets });
    return r;
  });
  return (await budgetPlansOut(deps, [row]))[0];
}

/**
 * Approves a proposed plan: it becomes the vessel's running-hour limits for voyage plans; an earlier approved
 * plan of the vessel is superseded in the same transaction. An infeasible proposal cannot be approved.
 */
export async function approveHourBudgetPlan(deps: AppDeps, actor: Actor, vesselId: string, planId: string): Promise<HourBudgetPlan> {
  const row = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(hourBudgetPlans).where(and(eq(hourBudgetPlans.id, planId), eq(hourBudgetPlans.vesselId, vesselId))).for('update');
    if (!before) throw notFound('Hour-budget plan');
    if (before.status !== 'proposed') throw new AppError('conflict', `This plan is ${before.status}; only a proposed plan can be approved`);
    if ((before.result as StaggerResult).status === 'infeasible') throw new AppError('conflict', 'An infeasible proposal has no budgets to approve');
    const superseded = await tx
      .update(hourBudgetPlans)
      .set({ status: 'superseded' })
      .where(and(eq(hourBudgetPlans.vesselId, vesselId), eq(hourBudgetPlans.status, 'approved')))
      .returning({ id: hourBudgetPlans.id });
    for (const s of superseded) await recordAudit(tx, actor, 'hour_budget_plan', s.id, 'update', { status: 'approved' }, { status: 'superseded' });
    const [after] = await tx
      .update(hourBudgetPlans)
      .set({ status: 'approved', approvedBy: actor.userId, approvedAt: deps.now() })
      .where(eq(hourBudgetPlans.id, planId))
      .returning();
    await recordAudit(tx, actor, 'hour_budget_plan', after.id, 'update', { status: before.status }, { status: after.status, approvedBy: actor.userId });
    return after;
  });
  return (await budgetPlansOut(deps, [row]))[0];
}
