/**
 * The link from the overhaul planner to the voyage plan: an hour-budget plan saved and approved through the overhaul
 * API (POST /api/vessels/:id/hour-budgets, then .../approve) becomes the running-hour limits of a voyage plan
 * solved after the approval, pro rata to the plan's horizon; a plan solved before the approval (only a proposed
 * row) has no limits and runs the cheapest set beyond its budget, so the budget is shown to bite.
 *
 * References:
 * - Pro rata budget: approved budget × plan horizon / (proposal horizon in days × 24 h), hand arithmetic written
 *   beside the checks (tolerance TOL_H).
 * - Each plan is checked with optimizer/plan checkPlan rebuilt here from the plan's stored inputs with the limits
 *   computed in this test (independent of the server's reader), default checkPlan tolerances 1e-6.
 * - Stagger fixture: the four-set arrangement of tests/integration/overhaul.test.ts (hours left 1100, 200, 400,
 *   1000 h at 9 h/day, four windows, 14-day gap, 181 days) whose only feasible placement is hand-computed there.
 * - Fuel curves: quadratic F(P) = a + bP + cP² written out as shop-test SFOC points; with them one set at 600 kW is
 *   cheaper than two (hand computation beside the curves), so without limits the cheapest set runs every hour.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { GensetUnit } from '../../optimizer/index';
import { checkPlan, type PlanProblem } from '../../optimizer/plan/index';
import { gensetDailyLogs, gensetMaintenance, gensets } from '../../server/db/schema';
import type { HourBudgetPlan } from '../../shared/schemas/overhaul';
import type { PlanDetail } from '../../shared/schemas/plans';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

const TOL_H = 1e-6; // hours: products and quotients of exact figures

/*
 * Curves (kg/h at kW). At 600 kW: DG1 30 + 108 + 7.2 = 145.2 kg/h; two sets at 300 kW each cost at least
 * 2 × (30 + 54 + 1.8) = 171.6 kg/h, so one DG1 is the least fuel when unlimited. DG1 is also cheapest at 75 %
 * (30 + 135 + 11.25 = 176.25 kg/h), the figure the stagger prices a running hour with.
 */
const SETS = [
  { designation: 'DG1', curve: { a: 30, b: 0.18, c: 2.0e-5 }, hoursLeft: 1100 },
  { designation: 'DG2', curve: { a: 40, b: 0.19, c: 2.0e-5 }, hoursLeft: 200 },
  { designation: 'DG3', curve: { a: 40, b: 0.19, c: 2.2e-5 }, hoursLeft: 400 },
  { designation: 'DG4', curve: { a: 45, b: 0.195, c: 2.0e-5 }, hoursLeft: 1000 },
];
const RATED_KW = 1000;
const fuel = (k: { a: number; b: number; c: number }, p: number) => k.a + k.b * p + k.c * p * p;
const sfoc = (k: { a: number; b: number; c: number }, p: number) => (1000 * fuel(k, p)) / p;

const WINDOWS = [
  { kind: 'port_call', place: 'Port A', startsOn: '2027-01-21', endsOn: '2027-01-23' },
  { kind: 'port_call', place: 'Port B', startsOn: '2027-02-15', endsOn: '2027-02-18' },
  { kind: 'port_call', place: 'Port C', startsOn: '2027-04-01', endsOn: '2027-04-03' },
  { kind: 'port_call', place: 'Yard D', startsOn: '2027-05-21', endsOn: '2027-05-26' },
];
const STAGGER_REQUEST = { untilDate: '2027-07-01', minGapDays: 14 };
const HORIZON_DAYS = 181; // 2027-01-01 → 2027-07-01: 31 + 28 + 31 + 30 + 31 + 30
/** Two days at sea at 600 kW in hourly periods. */
const PLAN_HOURS = 48;
const periods = Array.from({ length: PLAN_HOURS }, () => ({ durationH: 1, mode: 'sea', loadKw: 600 }));

let app: TestApp;
let tenant: Tenant;
let planner: HttpClient;
let superintendent: HttpClient;
let vesselId: string;
const ids: Record<string, string> = {};

beforeAll(async () => {
  app = await startTestApp();
  app.advance(Date.parse('2027-01-05T12:00:00Z') - Date.now());
  tenant = await createTenant(app, 'Guillemot Reefers');
  vesselId = tenant.vesselIds[1];
  const db = app.database.db;
  for (const s of SETS) {
    const pt = (pct: number) => sfoc(s.curve, (pct * RATED_KW) / 100);
    const [g] = await db
      .insert(gensets)
      .values({
        vesselId,
        designation: s.designation,
        ratedKw: RATED_KW,
        ratedKva: RATED_KW * 1.25,
        voltageV: 440,
        frequencyHz: 60,
        speedClass: 'medium',
        minLoadPct: 30,
        maxLoadPct: 100,
        shopTestSfoc: { p25: pt(25), p50: pt(50), p75: pt(75), p85: pt(85), p100: pt(100) },
      })
      .returning();
    ids[s.designation] = g.id;
    // 9 h/day over the 30 days to 2027-01-01; top overhaul every 2000 h done so that hoursLeft h are left then.
    await db.insert(gensetDailyLogs).values([
      { gensetId: g.id, logDate: '2026-12-02', runningHoursMeter: 2000 },
      { gensetId: g.id, logDate: '2027-01-01', runningHoursMeter: 2270 },
    ]);
    await db.insert(gensetMaintenance).values({ gensetId: g.id, kind: 'top overhaul', intervalHours: 2000, lastDoneRunningHours: 270 + s.hoursLeft, lastDoneOn: '2026-06-01' });
  }
  planner = app.client();
  superintendent = app.client();
  expect((await planner.signIn(tenant.emails.planner)).status).toBe(200);
  expect((await superintendent.signIn(tenant.emails.superintendent)).status).toBe(200);
  for (const w of WINDOWS) expect((await planner.post(`/api/vessels/${vesselId}/work-windows`, w)).status).toBe(201);
}, 60_000);
afterAll(() => app?.close());

const base = () => `/api/vessels/${vesselId}`;

async function solvePlan(name: string): Promise<PlanDetail> {
  const res = await planner.post<PlanDetail>(`${base()}/plans`, { name, periods });
  expect(res.status).toBe(202);
  for (let i = 0; i < 600; i++) {
    const got = await planner.get<PlanDetail>(`${base()}/plans/${res.body.id}`);
    if (got.body.status === 'solved' || got.body.status === 'failed') return got.body;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('plan did not finish in 60 s');
}

/** The optimizer problem of a plan's stored inputs with the limits given here (bus tie closed, one section). */
function problemOf(d: PlanDetail, limitsH: Record<string, number>): PlanProblem {
  const units: GensetUnit[] = d.units.map((u) => ({
    id: u.gensetId,
    name: u.designation,
    ratedKw: u.ratedKw,
    minLoadPct: u.minLoadPct,
    maxLoadPct: u.maxLoadPct,
    curve: { kind: 'quadratic', ...u.curve },
    busSection: u.busSection,
    available: u.available,
    mustRun: u.mustRun,
    startCostKg: u.startCostKg,
    minUpH: u.minUpH,
    minDownH: u.minDownH,
  }));
  return { units, periods: d.profile.map((p) => ({ durationH: p.durationH, rule: d.rules[p.mode], loadKw: p.loadKw })), maxRunningHours: limitsH };
}

function checkAgainst(d: PlanDetail, limitsH: Record<string, number>) {
  const r = d.result!;
  return checkPlan(problemOf(d, limitsH), {
    solver: 'decomposition',
    status: r.status,
    statusText: r.statusText,
    periods: r.periods.map((p) => ({ runningIds: p.runningIds, loadsKw: p.loadsKw, fuelKg: p.fuelKg })),
    runningFuelKg: r.runningFuelKg,
    startFuelKg: r.startFuelKg,
    totalFuelKg: r.totalFuelKg,
    units: r.units.map((u) => ({ unitId: u.gensetId, starts: u.starts, runningHours: u.runningHours, budgetH: u.budgetH })),
    lowerBoundKg: r.lowerBoundKg,
    gapPct: r.gapPct,
    infeasiblePeriods: [],
    reasons: [],
  });
}

describe('approved hour budgets as voyage-plan limits', () => {
  it('limits a plan solved after the approval to the pro-rata budgets; before it the cheapest set overruns', async () => {
    const saved = await planner.post<HourBudgetPlan>(`${base()}/hour-budgets`, STAGGER_REQUEST);
    expect(saved.status).toBe(201);
    expect(saved.body.status).toBe('proposed');
    expect(saved.body.result.status).toBe('in-windows');
    expect(saved.body.result.horizonDays).toBe(HORIZON_DAYS);
    const budgets = saved.body.result.hourBudgets;
    expect(Object.keys(budgets).sort()).toEqual(Object.values(ids).sort());
    // Pro rata to two days: budget × 48 / (181 × 24). DG1 takes the slack of 36 set-hours a day (overhaul.test.ts):
    // (36 − 200/22 − 400/48 − 1000/92) × 181 × 48 / 4344 = 7.706193 × 2 = 15.412 h.
    const limitsH = Object.fromEntries(Object.entries(budgets).map(([id, h]) => [id, (h * PLAN_HOURS) / (HORIZON_DAYS * 24)]));
    expect(Math.abs(limitsH[ids.DG1] - 2 * (36 - 200 / 22 - 400 / 48 - 1000 / 92))).toBeLessThan(TOL_H);
    expect(limitsH[ids.DG1]).toBeLessThan(PLAN_HOURS);
    // The four limits leave room for one set every hour: 2 × 36 = 72 ≥ 48 set-hours.
    expect(Object.values(limitsH).reduce((s, h) => s + h, 0)).toBeGreaterThanOrEqual(PLAN_HOURS);

    // Only proposed: the plan has no limits, and the cheapest set runs all 48 h, beyond its budget.
    const before = await solvePlan('Before approval');
    expect(before.status).toBe('solved');
    expect(before.budgetSource).toBe('none');
    expect(before.result!.check.feasible).toBe(true);
    const dg1Before = before.result!.units.find((u) => u.gensetId === ids.DG1)!;
    expect(dg1Before.budgetH).toBeNull();
    expect(dg1Before.runningHours).toBeGreaterThan(limitsH[ids.DG1] + TOL_H);
    expect(checkAgainst(before, limitsH).feasible).toBe(false); // the same schedule breaks the budget

    const approved = await superintendent.post<HourBudgetPlan>(`${base()}/hour-budgets/${saved.body.id}/approve`);
    expect(approved.status).toBe(200);
    expect(approved.body.status).toBe('approved');

    const after = await solvePlan('After approval');
    expect(after.status).toBe('solved');
    expect(after.budgetSource).toBe('approved_overhaul_plan');
    const r = after.result!;
    expect(r.status).not.toBe('infeasible');
    expect(r.check.feasible).toBe(true);
    for (const s of SETS) {
      const u = r.units.find((x) => x.gensetId === ids[s.designation])!;
      expect(Math.abs((u.budgetH ?? NaN) - limitsH[u.gensetId])).toBeLessThan(TOL_H);
      expect(u.runningHours).toBeLessThanOrEqual(limitsH[u.gensetId] + TOL_H);
    }
    // Every hour still carries the load, and the schedule passes checkPlan with the limits computed here.
    for (const p of r.periods) expect(Math.abs(p.loadsKw.reduce((s, x) => s + x, 0) - 600)).toBeLessThan(1e-6);
    const check = checkAgainst(after, limitsH);
    expect(check.violations).toEqual([]);
    expect(check.feasible).toBe(true);
    // The limits cost fuel: the budgeted plan burns at least what the unlimited one did.
    expect(r.totalFuelKg).toBeGreaterThan(before.result!.totalFuelKg);
  }, 120_000);
});
