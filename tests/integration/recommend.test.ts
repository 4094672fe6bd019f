/**
 * Recommendations and voyage plans through the API against the real database: operating rules, set status, one
 * operating point, the versioned guideline, a plan solved in a worker thread, approval, and who may call what.
 *
 * Reference values:
 * - Known curves: every set's shop-test SFOC is computed exactly from F(P) = a + bP + cP² (hand computation, no
 *   rounding), the vessel has no logs, so the plant model must recover (a, b, c) from the shop test. Reference: an
 *   ordinary least-squares quadratic through the same five points solved with ml-matrix (general-purpose library),
 *   to 1e-6 relative; the exact curve to 1e-6 relative.
 * - Single point: the API's answer equals optimizer/dispatch rankCombinations called directly on the same plant
 *   (fuel to 1e-9 relative, loads to 1e-6 kW). The textbook checks of the dispatch live in its unit tests.
 * - Plan: the solved plan passes optimizer/plan checkPlan, rebuilt here from the API's stored inputs (default
 *   tolerances 1e-6), and a re-solve from the stored inputs gives the same result.
 */
import { eq } from 'drizzle-orm';
import { Matrix, solve } from 'ml-matrix';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rankCombinations } from '../../optimizer/dispatch/index';
import type { GensetUnit } from '../../optimizer/index';
import { checkPlan, type PlanProblem, type VoyagePlan } from '../../optimizer/plan/index';
import { auditLog, busSections, gensets } from '../../server/db/schema';
import type { PlanDetail } from '../../shared/schemas/plans';
import type { Guideline, PlantModel, PlantUnit, SinglePointResult } from '../../shared/schemas/recommendations';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

const SETS = [
  { designation: 'DG1', ratedKw: 1000, curve: { a: 40, b: 0.19, c: 2.0e-5 }, section: 'A' },
  { designation: 'DG2', ratedKw: 1000, curve: { a: 45, b: 0.185, c: 2.5e-5 }, section: 'B' },
  { designation: 'DG3', ratedKw: 1500, curve: { a: 60, b: 0.18, c: 1.5e-5 }, section: 'B' },
];
const fuel = (k: { a: number; b: number; c: number }, p: number) => k.a + k.b * p + k.c * p * p;
const sfoc = (k: { a: number; b: number; c: number }, p: number) => (1000 * fuel(k, p)) / p;

let app: TestApp;
let a: Tenant;
let b: Tenant;
const c: Record<string, HttpClient> = {};
let vesselId: string;
let otherVesselId: string;
const ids: Record<string, string> = {};
let emergencyId: string;

async function sign(key: string, email: string) {
  c[key] = app.client();
  expect((await c[key].signIn(email)).status).toBe(200);
}

beforeAll(async () => {
  app = await startTestApp();
  a = await createTenant(app, 'Skua Carriers');
  b = await createTenant(app, 'Tern Tankers');
  vesselId = a.vesselIds[0];
  otherVesselId = a.vesselIds[1];
  const db = app.database.db;
  const secs = await db.insert(busSections).values([{ vesselId, name: 'A', sortOrder: 0 }, { vesselId, name: 'B', sortOrder: 1 }]).returning();
  const secId = (n: string) => secs.find((s) => s.name === n)!.id;
  for (const s of SETS) {
    const pt = (pct: number) => sfoc(s.curve, (pct * s.ratedKw) / 100);
    const [g] = await db
      .insert(gensets)
      .values({
        vesselId,
        busSectionId: secId(s.section),
        designation: s.designation,
        ratedKw: s.ratedKw,
        ratedKva: s.ratedKw * 1.25,
        voltageV: 440,
        frequencyHz: 60,
        speedClass: 'medium',
        minLoadPct: 30,
        maxLoadPct: 90,
        startCostKg: 5,
        shopTestSfoc: { p25: pt(25), p50: pt(50), p75: pt(75), p85: pt(85), p100: pt(100) },
      })
      .returning();
    ids[s.designation] = g.id;
  }
  const [em] = await db
    .insert(gensets)
    .values({
      vesselId,
      designation: 'EG',
      ratedKw: 200,
      ratedKva: 250,
      voltageV: 440,
      frequencyHz: 60,
      speedClass: 'high',
      minLoadPct: 10,
      maxLoadPct: 100,
      duty: 'emergency',
      shopTestSfoc: { p25: 260, p50: 240, p75: 230, p85: 232, p100: 236 },
    })
    .returning();
  emergencyId = em.id;
  await sign('admin', a.emails.admin);
  await sign('super', a.emails.superintendent);
  await sign('chief', a.emails.chief_engineer);
  await sign('energy', a.emails.energy_officer);
  await sign('planner', a.emails.planner);
  await sign('otherAdmin', b.emails.admin);
}, 60_000);
afterAll(() => app?.close());

const base = () => `/api/vessels/${vesselId}`;

/** The optimizer's units from the plant units an API response carries (written out here, not the server's mapper). */
function unitsOf(plant: PlantUnit[]): GensetUnit[] {
  return plant.map((u) => ({
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
}

describe('plant model', () => {
  it('uses shop-test curves when no fit exists, recovering the curve the points were made from; no emergency set', async () => {
    const res = await c.chief.get<PlantModel>(`${base()}/plant-model`);
    expect(res.status).toBe(200);
    expect(res.body.units.map((u) => u.designation)).toEqual(['DG1', 'DG2', 'DG3']);
    expect(res.body.units.some((u) => u.gensetId === emergencyId)).toBe(false);
    for (const s of SETS) {
      const u = res.body.units.find((x) => x.designation === s.designation)!;
      expect(u.curveSource).toBe('shop_test');
      expect(u.busSection).toBe(s.section);
      // Reference: OLS normal equations (X'X) beta = X'y solved with ml-matrix on the five shop-test points.
      const loads = [25, 50, 75, 85, 100].map((p) => (p * s.ratedKw) / 100);
      const X = new Matrix(loads.map((p) => [1, p, p * p]));
      const y = Matrix.columnVector(loads.map((p) => (sfoc(s.curve, p) * p) / 1000));
      const beta = solve(X.transpose().mmul(X), X.transpose().mmul(y)).to1DArray();
      expect(Math.abs(u.curve.a - beta[0]) / beta[0]).toBeLessThan(1e-6);
      expect(Math.abs(u.curve.b - beta[1]) / beta[1]).toBeLessThan(1e-6);
      expect(Math.abs(u.curve.c - beta[2]) / beta[2]).toBeLessThan(1e-6);
      expect(Math.abs(u.curve.c - s.curve.c) / s.curve.c).toBeLessThan(1e-6);
    }
  });
});

describe('operating rules and set status', () => {
  it('lists defaults, lets the chief engineer edit his own vessel, refuses others', async () => {
    const res = await c.energy.get(`${base()}/operating-rules`);
    expect(res.status).toBe(200);
    expect(res.body.rules).toHaveLength(4);
    expect(res.body.rules.every((r: { stored: boolean }) => !r.stored)).toBe(true);
    const sea = { marginKw: 100, marginPct: 10, minSets: 1, nMinus1: false, busTieClosed: true };
    const put = await c.chief.request('PUT', `${base()}/operating-rules/sea`, sea);
    expect(put.status).toBe(200);
    expect(put.body.rules.find((r: { mode: string }) => r.mode === 'sea')).toMatchObject({ ...sea, stored: true });
    expect((await c.energy.request('PUT', `${base()}/operating-rules/sea`, sea)).status).toBe(403);
    expect((await c.chief.request('PUT', `/api/vessels/${otherVesselId}/operating-rules/sea`, sea)).status).toBe(404);
    expect((await c.otherAdmin.request('PUT', `${base()}/operating-rules/sea`, sea)).status).toBe(404);
    expect((await c.admin.request('PUT', `${base()}/operating-rules/cruising`, sea)).status).toBe(404);
    const bad = await c.admin.request('PUT', `${base()}/operating-rules/port`, { ...sea, minSets: 1.5 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details[0].path).toBe('minSets');
    const audits = await app.database.db.select().from(auditLog).where(eq(auditLog.entity, 'operating_rule'));
    expect(audits).toHaveLength(1);
    const man = { marginKw: 0, marginPct: 20, minSets: 2, nMinus1: true, busTieClosed: false };
    expect((await c.super.request('PUT', `${base()}/operating-rules/manoeuvring`, man)).status).toBe(200);
  });

  it('sets availability and must-run (chief engineer, superintendent only)', async () => {
    const path = `${base()}/gensets/${ids.DG2}/status`;
    expect((await c.admin.request('PUT', path, { available: true, mustRun: false })).status).toBe(403);
    const noReason = await c.chief.request('PUT', path, { available: false, mustRun: false });
    expect(noReason.status).toBe(422);
    expect((await c.chief.request('PUT', `${base()}/gensets/${emergencyId}/status`, { available: true, mustRun: true })).status).toBe(422);
    expect((await c.otherAdmin.request('PUT', path, { available: true, mustRun: false })).status).toBe(403);
    const ok = await c.chief.request('PUT', path, { available: false, unavailableReason: 'Liner change', mustRun: false });
    expect(ok.status).toBe(200);
    const model = await c.chief.get<PlantModel>(`${base()}/plant-model`);
    expect(model.body.units.find((u) => u.designation === 'DG2')!.available).toBe(false);
    expect((await c.super.request('PUT', path, { available: true, mustRun: false })).status).toBe(200);
  });
});

describe('one operating point', () => {
  it('equals rankCombinations called directly on the same plant', async () => {
    const res = await c.chief.post<SinglePointResult>(`${base()}/recommendations`, { mode: 'sea', loadKw: 1800 });
    expect(res.status).toBe(200);
    const r = res.body;
    expect(r.feasible).toBe(true);
    expect(r.caution).toMatch(/chief engineer decide/);
    const units = unitsOf(r.plant.units);
    const direct = rankCombinations(units, 1800, { marginKw: 100, marginPct: 10, minSets: 1, nMinus1: false, busTieClosed: true });
    if (!direct.feasible) throw new Error('direct call infeasible');
    expect(r.combinations).toHaveLength(direct.combinations.length);
    r.combinations.forEach((comb, i) => {
      const d = direct.combinations[i];
      expect(comb.gensetIds).toEqual(d.unitIds);
      expect(Math.abs(comb.fuelKgPerH - d.fuelKgPerH) / d.fuelKgPerH).toBeLessThan(1e-9);
      comb.units.forEach((u, j) => expect(Math.abs(u.loadKw - d.units[j].loadKw)).toBeLessThan(1e-6));
    });
    expect(r.unitReasons.map((u) => u.reason)).toEqual(direct.unitReasons.map((u) => u.reason));
    expect(r.savedFuelKgPerDay).toBeCloseTo(direct.savedFuelKgPerDay!, 9);
    // 1800 kW + 180 kW margin needs 1980 kW online: a 900 + 1350 kW pair at least.
    expect(r.combinations[0].capacityKw).toBeGreaterThanOrEqual(1980);
  });

  it('answers an infeasible load with reasons (200, not an error) and asks for section loads with the tie open', async () => {
    const res = await c.planner.post<SinglePointResult>(`${base()}/recommendations`, { mode: 'sea', loadKw: 5000 });
    expect(res.status).toBe(200);
    expect(res.body.feasible).toBe(false);
    expect(res.body.reasons.join(' ')).toMatch(/exceeds the 3150 kW maximum continuous capacity/);
    const open = await c.planner.post(`${base()}/recommendations`, { mode: 'manoeuvring', loadKw: 1000 });
    expect(open.status).toBe(422);
    expect(open.body.error.details[0].path).toBe('sectionLoadsKw');
    const split = await c.planner.post<SinglePointResult>(`${base()}/recommendations`, { mode: 'manoeuvring', sectionLoadsKw: { A: 300, B: 700 } });
    expect(split.status).toBe(200);
    // Section A has one set: minimum two sets per section cannot be met there.
    expect(split.body.feasible).toBe(false);
    expect(split.body.reasons.join(' ')).toMatch(/bus section A: minimum two sets/);
    expect((await c.admin.post(`${base()}/recommendations`, { mode: 'sea' })).status).toBe(422);
    expect((await c.admin.post(`${base()}/recommendations`, { mode: 'sea', loadKw: -5 })).status).toBe(422);
  });
});

describe('operating guideline', () => {
  it('keeps its version while inputs are unchanged and makes a new one when a rule changes', async () => {
    const first = await c.chief.post<Guideline>(`${base()}/guidelines/current`);
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(1);
    expect(first.body.created).toBe(true);
    const sea = first.body.modes.find((m) => m.mode === 'sea')!;
    expect(sea.bands.length).toBeGreaterThan(0);
    expect(first.body.caution).toMatch(/power management system/);
    const again = await c.admin.post<Guideline>(`${base()}/guidelines/current`);
    expect(again.body.version).toBe(1);
    expect(again.body.created).toBe(false);
    expect(again.body.inputHash).toBe(first.body.inputHash);
    await c.super.request('PUT', `${base()}/operating-rules/port`, { marginKw: 200, marginPct: 0, minSets: 2, nMinus1: false, busTieClosed: true });
    const next = await c.chief.post<Guideline>(`${base()}/guidelines/current`);
    expect(next.body.version).toBe(2);
    expect(next.body.inputHash).not.toBe(first.body.inputHash);
    const list = await c.energy.get(`${base()}/guidelines`);
    expect(list.body.map((g: { version: number }) => g.version)).toEqual([2, 1]);
    const v1 = await c.energy.get<Guideline>(`${base()}/guidelines/1`);
    expect(v1.body.modes).toEqual(first.body.modes);
    expect((await c.energy.get(`${base()}/guidelines/7`)).status).toBe(404);
    expect((await c.otherAdmin.post(`${base()}/guidelines/current`)).status).toBe(404);
    expect((await c.chief.post(`/api/vessels/${otherVesselId}/guidelines/current`)).status).toBe(404);
  });
});

async function waitSolved(client: HttpClient, planId: string): Promise<PlanDetail> {
  for (let i = 0; i < 600; i++) {
    const res = await client.get<PlanDetail>(`${base()}/plans/${planId}`);
    if (res.body.status === 'solved' || res.body.status === 'failed') return res.body;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('plan did not finish in 60 s');
}

/** The optimizer problem rebuilt from a plan's stored inputs as the API returns them (bus tie closed here). */
function problemOf(d: PlanDetail): PlanProblem {
  return {
    units: unitsOf(d.units),
    periods: d.profile.map((p) => ({ durationH: p.durationH, rule: d.rules[p.mode], loadKw: p.loadKw })),
    maxRunningHours: Object.fromEntries(d.result!.units.filter((u) => u.budgetH !== null).map((u) => [u.gensetId, u.budgetH!])),
  };
}

describe('voyage plan', () => {
  let planId: string;
  let solved: PlanDetail;

  it('solves through the worker thread to solved, and the plan passes checkPlan', async () => {
    const periods = Array.from({ length: 48 }, (_, t) => ({ durationH: 1, mode: t < 40 ? 'sea' : 'port', loadKw: 900 + 500 * Math.sin(t / 5) }));
    const res = await c.planner.post<PlanDetail>(`${base()}/plans`, { name: 'Two days', periods, hourBudgetsH: { [ids.DG3]: 30 } });
    expect(res.status).toBe(202);
    expect(['queued', 'solving']).toContain(res.body.status);
    planId = res.body.id;
    solved = await waitSolved(c.planner, planId);
    expect(solved.status).toBe('solved');
    const r = solved.result!;
    expect(r.status).not.toBe('infeasible');
    expect(r.check.feasible).toBe(true);
    expect(r.periods).toHaveLength(48);
    const plan: VoyagePlan = {
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
    };
    const check = checkPlan(problemOf(solved), plan);
    expect(check.violations).toEqual([]);
    expect(r.units.find((u) => u.gensetId === ids.DG3)!.runningHours).toBeLessThanOrEqual(30 + 1e-9);
    expect(r.savingFuelKg).not.toBeNull();
    expect(r.savingFuelKg!).toBeGreaterThanOrEqual(-1e-6); // the baseline is one feasible plan of the same problem
    expect(r.co2Kg).toBeGreaterThan(r.totalFuelKg * 3); // VLSFO Cf ≈ 3.15 t CO2/t (MEPC.364(79), from memory)
    expect(solved.budgetSource).toBe('typed');
  }, 90_000);

  it('re-solves from the stored inputs to the same result', async () => {
    const res = await c.energy.post<PlanDetail>(`${base()}/plans/${planId}/resolve`);
    expect(res.status).toBe(202);
    const again = await waitSolved(c.energy, res.body.id);
    expect(again.resolvedFrom).toBe(planId);
    const { solveMs: _a, ...x } = again.result!;
    const { solveMs: _b, ...y } = solved.result!;
    expect(x).toEqual(y);
  }, 90_000);

  it('is approved by a superintendent only', async () => {
    expect((await c.chief.post(`${base()}/plans/${planId}/approve`)).status).toBe(403);
    expect((await c.planner.post(`${base()}/plans/${planId}/approve`)).status).toBe(403);
    expect((await c.admin.post(`${base()}/plans/${planId}/approve`)).status).toBe(403);
    const ok = await c.super.post<PlanDetail>(`${base()}/plans/${planId}/approve`);
    expect(ok.status).toBe(200);
    expect(ok.body.status).toBe('approved');
    expect(ok.body.approvedBy).toMatch(/superintendent/);
    expect((await c.super.post(`${base()}/plans/${planId}/approve`)).status).toBe(409);
  });

  it('rejects bad profiles and hides plans from other companies and other vessels', async () => {
    const long = await c.planner.post(`${base()}/plans`, { name: 'Too long', periods: [{ durationH: 721, mode: 'sea', loadKw: 500 }] });
    expect(long.status).toBe(422);
    const unknownSet = await c.planner.post(`${base()}/plans`, { name: 'x', periods: [{ durationH: 1, mode: 'sea', loadKw: 500 }], hourBudgetsH: { [emergencyId]: 3 } });
    expect(unknownSet.status).toBe(422);
    expect((await c.otherAdmin.get(`${base()}/plans/${planId}`)).status).toBe(404);
    expect((await c.otherAdmin.get(`${base()}/plans`)).status).toBe(404);
    expect((await c.chief.get(`/api/vessels/${otherVesselId}/plans`)).status).toBe(404);
    expect((await c.chief.get(`/api/vessels/${otherVesselId}/plans/${planId}`)).status).toBe(404);
    const list = await c.chief.get(`${base()}/plans`);
    expect(list.body.map((p: { id: string }) => p.id)).toContain(planId);
  });

  it('builds a profile from history (no logs here: every leg warns)', async () => {
    const res = await c.planner.post(`${base()}/plans/profile-from-history`, { from: '2026-01-01', to: '2026-01-31', sequence: [{ mode: 'sea', hours: 24 }] });
    expect(res.status).toBe(200);
    expect(res.body.periods).toEqual([]);
    expect(res.body.warnings[0]).toMatch(/no logged day in sea/);
  });
});

describe('every new route refuses other companies', () => {
  it('answers 404 to another company for each vessel route', async () => {
    const routes: [string, string, unknown?][] = [
      ['GET', `${base()}/operating-rules`],
      ['GET', `${base()}/plant-model`],
      ['POST', `${base()}/recommendations`, { mode: 'sea', loadKw: 500 }],
      ['GET', `${base()}/guidelines`],
      ['POST', `${base()}/plans`, { name: 'x', periods: [{ durationH: 1, mode: 'sea', loadKw: 500 }] }],
      ['POST', `${base()}/plans/profile-from-history`, { from: '2026-01-01', to: '2026-01-02', sequence: [{ mode: 'sea', hours: 2 }] }],
    ];
    for (const [method, path, body] of routes) {
      expect((await c.otherAdmin.request(method, path, body)).status, `${method} ${path}`).toBe(404);
      expect((await c.chief.request(method, path.replace(vesselId, otherVesselId), body)).status, `chief ${method} ${path}`).toBe(404);
    }
  });
});
