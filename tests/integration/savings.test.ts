/**
 * Savings, fuel prices, fleet benchmark and reports through the API against the real database.
 *
 * Reference values:
 * - The textbook check of the savings arithmetic (Saadat, Power System Analysis, Example 7.4: equal thirds of
 *   800 MW against the published optimum 400 / 250 / 150 MW) is in tests/unit/savings-daily.test.ts and is not
 *   repeated here; this file checks that the API hands the stored data to optimizer/savings unchanged: the API's
 *   per-day avoidable fuel and equal-vs-optimal split saving must equal vesselSavings called directly on the
 *   fixture with the API's own fitted curves (1e-9 relative).
 * - CO2: IMO MEPC.364(79) Cf of diesel/gas oil (MGO) 3.206 t CO2 / t fuel.
 * - Cost: hand-computed from the fixture's measured fuel and two MGO prices (600 /t from 2026-02-01, 700 /t
 *   from 2026-03-01).
 * - Three sets of 1000 kW with invented quadratic curves (illustrative, not from a maker); fuel logged from the
 *   true curve with seeded 1 % noise (mulberry32, optimizer/random.ts); LCV of the lot 42.7 MJ/kg = the ISO 3046-1
 *   reference, so no LCV correction.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { createRng, dateOfDayNumber, dayNumber, FUEL_GRADES, vesselSavings, type GensetUnit } from '../../optimizer/index';
import { fuelLots, gensetDailyLogs, gensets, operatingRules, vesselModeHours } from '../../server/db/schema';
import type { VesselCurves } from '../../shared/schemas/curves';
import type { FleetBenchmark } from '../../shared/schemas/fleet';
import type { MonthlyReport } from '../../shared/schemas/reports';
import { PRICED_FUEL_GRADES, type FuelPriceRow, type VesselSavingsReport } from '../../shared/schemas/savings';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

const REL = 1e-9;
const CF_MGO = 3.206; // MEPC.364(79), diesel/gas oil
const TRUE = {
  DG1: { a: 20, b: 0.19, c: 2e-5 },
  DG2: { a: 25, b: 0.185, c: 3e-5 },
  DG3: { a: 15, b: 0.2, c: 1.5e-5 },
} as const;
type Name = keyof typeof TRUE;
const FIRST = '2026-02-15';
const DAYS = 30; // 2026-02-15 .. 2026-03-16
const FROM = '2026-02-15';
const TO = '2026-03-16';
const PRICES = [
  { grade: 'MGO', pricePerT: 600, validFrom: '2026-02-01' },
  { grade: 'MGO', pricePerT: 700, validFrom: '2026-03-01' },
] as const;

let app: TestApp;
let a: Tenant;
let b: Tenant;
let admin: HttpClient;
let superintendent: HttpClient;
let officer: HttpClient;
let chief: HttpClient;
let planner: HttpClient;
let otherAdmin: HttpClient;
let vesselId: string;
const ids: Record<Name, string> = { DG1: '', DG2: '', DG3: '' };
/** The fixture as logged: per date, per set (hours, kWh, measured kg), and the mode hours. */
const fixture: { date: string; sets: { name: Name; hoursRun: number; kwh: number; fuelKg: number }[]; sea: number; port: number }[] = [];

const fuel = (n: Name, p: number) => TRUE[n].a + TRUE[n].b * p + TRUE[n].c * p * p;
const sfoc = (n: Name, pct: number) => (1000 * fuel(n, pct * 10)) / (pct * 10);
const close = (x: number, y: number, rel = REL) => expect(Math.abs(x - y)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(y)));

beforeAll(async () => {
  app = await startTestApp();
  a = await createTenant(app, 'Skua Bulk');
  b = await createTenant(app, 'Tern Tankers');
  vesselId = a.vesselIds[0];
  const db = app.database.db;
  const [lot] = await db
    .insert(fuelLots)
    .values({ vesselId, reference: 'BDN-7', grade: 'MGO', density15KgPerM3: 850, lcvMjPerKg: 42.7, deliveredOn: '2026-01-10' })
    .returning();
  for (const n of Object.keys(TRUE) as Name[]) {
    const shop = (pct: number) => Math.round(sfoc(n, pct) * 10) / 10;
    const [g] = await db
      .insert(gensets)
      .values({
        vesselId,
        designation: n,
        ratedKw: 1000,
        ratedKva: 1250,
        voltageV: 440,
        frequencyHz: 60,
        speedClass: 'medium',
        minLoadPct: 30,
        maxLoadPct: 100,
        shopTestSfoc: { p25: shop(25), p50: shop(50), p75: shop(75), p85: shop(85), p100: shop(100) },
      })
      .returning();
    ids[n] = g.id;
  }
  await db.insert(operatingRules).values({ vesselId, mode: 'sea', marginPct: 10, minSets: 1 });
  const rng = createRng(20260315);
  const logs = [];
  const modes = [];
  for (let i = 0; i < DAYS; i++) {
    const date = dateOfDayNumber(dayNumber(FIRST) + i);
    const running: Name[] = i % 3 === 0 ? ['DG1', 'DG2', 'DG3'] : i % 3 === 1 ? ['DG1', 'DG2'] : ['DG2', 'DG3'];
    const sets = running.map((name) => {
      const hoursRun = i % 5 === 0 && name === 'DG3' ? 12 : 24;
      const loadKw = 250 + rng.uniform() * 600;
      const fuelKg = Math.round(fuel(name, loadKw) * hoursRun * (1 + rng.normal(0, 0.01)) * 1000) / 1000;
      return { name, hoursRun, kwh: Math.round(loadKw * hoursRun * 10) / 10, fuelKg };
    });
    const port = i % 4 === 0 ? 8 : 0;
    fixture.push({ date, sets, sea: 24 - port, port });
    modes.push({ vesselId, logDate: date, seaH: 24 - port, portH: port });
    for (const s of sets) logs.push({ gensetId: ids[s.name], logDate: date, hoursRun: s.hoursRun, kwh: s.kwh, fuelMassKg: s.fuelKg, fuelLotId: lot.id });
  }
  await db.insert(gensetDailyLogs).values(logs);
  await db.insert(vesselModeHours).values(modes);
  const clients = await Promise.all(
    [a.emails.admin, a.emails.superintendent, a.emails.energy_officer, a.emails.chief_engineer, a.emails.planner, b.emails.admin].map(async (email) => {
      const c = app.client();
      expect((await c.signIn(email)).status).toBe(200);
      return c;
    }),
  );
  [admin, superintendent, officer, chief, planner, otherAdmin] = clients;
  for (const p of PRICES) expect((await admin.request('PUT', '/api/fuel-prices', p)).status).toBe(200);
}, 120_000);
afterAll(() => app?.close());

const savingsOf = (c: HttpClient, v = vesselId, q = `from=${FROM}&to=${TO}`) => c.get<VesselSavingsReport>(`/api/vessels/${v}/savings?${q}`);

describe('savings of a vessel', () => {
  it('equals optimizer/savings vesselSavings called directly with the API’s fitted curves (per day, 1e-9 relative)', async () => {
    const res = await savingsOf(officer);
    expect(res.status).toBe(200);
    const curves = (await officer.get<VesselCurves>(`/api/vessels/${vesselId}/curves?window=since_overhaul`)).body;
    const units: GensetUnit[] = [];
    const fits: Record<string, { curve: { kind: 'quadratic'; a: number; b: number; c: number }; covariance: number[][]; dof: number }> = {};
    for (const n of Object.keys(TRUE) as Name[]) {
      const set = curves.sets.find((s) => s.gensetId === ids[n])!;
      expect(set.fit).not.toBeNull();
      const k = set.fit!.coefficients;
      const curve = { kind: 'quadratic' as const, a: k.a, b: k.b, c: k.c };
      units.push({ id: n, name: n, ratedKw: 1000, minLoadPct: 30, maxLoadPct: 100, curve, busSection: 'A', available: true, mustRun: false, startCostKg: 0, minUpH: 0, minDownH: 0 });
      fits[n] = { curve, covariance: set.fit!.covariance as number[][], dof: set.fit!.dof };
    }
    const rule = { marginKw: 0, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };
    const direct = vesselSavings(
      {
        units,
        fits,
        rules: { sea: { ...rule, marginPct: 10 }, port: rule, manoeuvring: rule, anchorage: rule },
        days: fixture.map((d) => ({
          date: d.date,
          modeHours: { sea: d.sea, ...(d.port ? { port: d.port } : {}) },
          sets: d.sets.map((s) => ({ unitId: s.name, hoursRun: s.hoursRun, kwh: s.kwh, measuredFuelKg: s.fuelKg })),
          fuel: { grade: 'MGO', lcvKjPerKg: 42_700, lot: { density15KgPerM3: 850 } },
        })),
      },
      { level: 0.95 },
    );
    const api = res.body;
    expect(api.days.length).toBe(DAYS);
    expect(api.skippedDays).toEqual([]);
    let someActualSplit = 0;
    for (const d of direct.days) {
      const got = api.days.find((x) => x.date === d.date)!;
      close(got.modelledActualFuelKg, d.modelledActualFuelKg);
      close(got.recommendedFuelKg!, d.recommendedFuelKg!);
      close(got.avoidableFuelKg!, d.avoidableFuelKg!);
      close(got.splitSavingRecommendedSetsKg!, d.splitSavingRecommendedSetsKg!);
      if (d.splitSavingActualSetsKg !== null) {
        someActualSplit++;
        close(got.splitSavingActualSetsKg!, d.splitSavingActualSetsKg);
      } else expect(got.splitSavingActualSetsKg).toBeNull();
    }
    expect(someActualSplit).toBeGreaterThan(10);
    close(api.period.avoidableFuelT.value, direct.period.avoidableFuelT.value);
    close(api.period.avoidableFuelT.lower, direct.period.avoidableFuelT.lower);
    close(api.period.avoidableFuelT.upper, direct.period.avoidableFuelT.upper);
    expect(api.period.avoidableFuelT.upper).toBeGreaterThan(api.period.avoidableFuelT.lower);
    close(api.period.splitSavingActualSetsT, direct.period.splitSavingActualSetsT);
    expect(api.byMonth.map((m) => m.label)).toEqual(['2026-02', '2026-03']);
    expect(api.caution).toMatch(/Kilowatch advises/);
  });

  it('measured fuel, CO2 (MEPC.364(79) Cf 3.206 for MGO) and cost match hand-computed totals', async () => {
    const api = (await savingsOf(officer)).body;
    let measuredKg = 0;
    let costMeasured = 0;
    for (const d of fixture) {
      const kg = d.sets.reduce((s, x) => s + x.fuelKg, 0);
      measuredKg += kg;
      costMeasured += (kg / 1000) * (d.date >= '2026-03-01' ? 700 : 600);
    }
    close(api.period.measuredFuelT!, measuredKg / 1000);
    close(api.period.co2.measuredT!, (CF_MGO * measuredKg) / 1000);
    const modelledKg = api.days.reduce((s, d) => s + d.modelledActualFuelKg, 0);
    close(api.period.co2.modelledActualT, (CF_MGO * modelledKg) / 1000);
    close(api.period.co2.avoidableT.value, CF_MGO * api.period.avoidableFuelT.value);
    expect(api.period.cost).not.toBeNull();
    expect(api.period.cost!.currency).toBe('USD');
    close(api.period.cost!.measured!, costMeasured, 1e-9);
    const avoidableCost = api.days.reduce((s, d) => s + ((d.avoidableFuelKg ?? 0) / 1000) * (d.date >= '2026-03-01' ? 700 : 600), 0);
    close(api.period.cost!.avoidable.value, avoidableCost);
  });

  it('rejects a bad period with a 422 naming the field', async () => {
    const res = await savingsOf(officer, vesselId, 'from=2026-03-10&to=2026-03-01');
    expect(res.status).toBe(422);
    expect((res.body as unknown as { error: { details: { path: string }[] } }).error.details[0].path).toBe('to');
  });
});

describe('fuel prices', () => {
  it('lists prices with derived validity; only an admin edits them', async () => {
    const list = await officer.get<FuelPriceRow[]>('/api/fuel-prices');
    expect(list.status).toBe(200);
    expect(list.body.map((p) => [p.validFrom, p.validTo])).toEqual([
      ['2026-02-01', '2026-02-28'],
      ['2026-03-01', null],
    ]);
    expect((await superintendent.request('PUT', '/api/fuel-prices', { grade: 'MGO', pricePerT: 1, validFrom: '2026-04-01' })).status).toBe(403);
    expect((await admin.request('PUT', '/api/fuel-prices', { grade: 'XYZ', pricePerT: 1, validFrom: '2026-04-01' })).status).toBe(422);
    expect((await otherAdmin.get<FuelPriceRow[]>('/api/fuel-prices')).body).toEqual([]);
    // The shared grade list mirrors optimizer/fuel's (shared/ cannot import optimizer/).
    expect([...PRICED_FUEL_GRADES]).toEqual([...FUEL_GRADES]);
    expect((await otherAdmin.delete(`/api/fuel-prices/${list.body[0].id}`)).status).toBe(404);
  });
});

describe('fleet benchmark and reports', () => {
  it('gives per-set SFOC at 75 % from the curve and plant SFOC from the logs', async () => {
    const res = await superintendent.get<FleetBenchmark>(`/api/fleet/benchmark?from=${FROM}&to=${TO}`);
    expect(res.status).toBe(200);
    expect(res.body.vessels.map((v) => v.vesselId).sort()).toEqual([...a.vesselIds].sort());
    const row = res.body.vessels.find((v) => v.vesselId === vesselId)!;
    // Plant SFOC (ISO) by hand: Σ logged kg / Σ kWh (LCV = ISO reference, factor 1).
    const kg = fixture.reduce((s, d) => s + d.sets.reduce((t, x) => t + x.fuelKg, 0), 0);
    const kwh = fixture.reduce((s, d) => s + d.sets.reduce((t, x) => t + x.kwh, 0), 0);
    close(row.plantSfocIsoGPerKwh!, (1000 * kg) / kwh, 1e-6);
    close(row.avoidableFuelT!.value, (await savingsOf(officer)).body.period.avoidableFuelT.value);
    const curves = (await officer.get<VesselCurves>(`/api/vessels/${vesselId}/curves?window=since_overhaul`)).body;
    for (const s of res.body.sets.filter((x) => x.vesselId === vesselId)) {
      const k = curves.sets.find((c) => c.gensetId === s.gensetId)!.fit!.coefficients;
      close(s.sfoc75GPerKwh, (1000 * (k.a + k.b * 750 + k.c * 750 * 750)) / 750);
    }
    expect(res.body.sisterCurves.find((g) => g.ratedKw === 1000)!.sets.length).toBe(3);
  });

  it('serves the vessel report as JSON, CSV and XLSX with the method and the caution', async () => {
    const json = await officer.get<MonthlyReport>(`/api/vessels/${vesselId}/reports/monthly?month=2026-03`);
    expect(json.status).toBe(200);
    expect(json.body.from).toBe('2026-03-01');
    expect(json.body.to).toBe('2026-03-31');
    expect(json.body.caution).toMatch(/Kilowatch advises/);
    const csv = await officer.get<string>(`/api/vessels/${vesselId}/reports/monthly.csv?month=2026-03`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toMatch(/text\/csv/);
    expect(csv.body).toMatch(/Avoidable fuel \(t\)/);
    expect(csv.body).toMatch(/Kilowatch advises/);
    const res = await fetch(`${app.baseUrl}/api/fleet/reports/monthly.xlsx?month=2026-03`, { headers: { cookie: officer.cookie! } });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(await res.arrayBuffer());
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Summary', 'Vessels', 'Sets']);
    expect(wb.getWorksheet('Vessels')!.rowCount).toBe(3);
    expect((await officer.get(`/api/vessels/${vesselId}/reports/monthly.pdf?month=2026-03`)).status).toBe(404);
  });
});

describe('who may see what', () => {
  it('energy officers, superintendents and admins see the fleet; chief engineers and planners do not', async () => {
    for (const c of [officer, superintendent, admin]) expect((await c.get(`/api/fleet/benchmark?from=${FROM}&to=${TO}`)).status).toBe(200);
    for (const c of [chief, planner]) expect((await c.get(`/api/fleet/benchmark?from=${FROM}&to=${TO}`)).status).toBe(403);
    expect((await chief.get('/api/fleet/reports/monthly?month=2026-03')).status).toBe(403);
    expect((await app.client().get(`/api/fleet/benchmark?from=${FROM}&to=${TO}`)).status).toBe(401);
  });

  it('chief engineers see their own vessel only; other companies see nothing', async () => {
    expect((await savingsOf(chief)).status).toBe(200);
    expect((await chief.get(`/api/vessels/${vesselId}/benchmark?from=${FROM}&to=${TO}`)).status).toBe(200);
    expect((await chief.get(`/api/vessels/${vesselId}/reports/monthly?month=2026-03`)).status).toBe(200);
    expect((await savingsOf(chief, a.vesselIds[1])).status).toBe(404);
    expect((await chief.get(`/api/vessels/${a.vesselIds[1]}/reports/monthly?month=2026-03`)).status).toBe(404);
    expect((await savingsOf(otherAdmin)).status).toBe(404);
    expect((await otherAdmin.get(`/api/vessels/${vesselId}/benchmark?from=${FROM}&to=${TO}`)).status).toBe(404);
    const theirs = await otherAdmin.get<FleetBenchmark>(`/api/fleet/benchmark?from=${FROM}&to=${TO}`);
    expect(theirs.body.vessels.map((v) => v.vesselId).sort()).toEqual([...b.vesselIds].sort());
  });

  it('subscriptions: the fleet report needs reports:read, a vessel must be in scope, each user sees their own', async () => {
    expect((await chief.post('/api/subscriptions', { kind: 'fleet_monthly_report' })).status).toBe(403);
    expect((await chief.post('/api/subscriptions', { kind: 'vessel_monthly_report', vesselId: a.vesselIds[1] })).status).toBe(404);
    expect((await otherAdmin.post('/api/subscriptions', { kind: 'vessel_monthly_report', vesselId })).status).toBe(404);
    const mine = await chief.post('/api/subscriptions', { kind: 'vessel_monthly_report', vesselId });
    expect(mine.status).toBe(201);
    expect(mine.body).toHaveLength(1);
    expect((await officer.get('/api/subscriptions')).body).toEqual([]);
    expect((await officer.delete(`/api/subscriptions/${mine.body[0].id}`)).status).toBe(404);
    expect((await chief.delete(`/api/subscriptions/${mine.body[0].id}`)).status).toBe(204);
  });
});

