/**
 * Running hours and overhaul planner through the API against the real database: hours since each maintenance
 * kind with a meter replacement and an overhaul recorded partway, due dates at recent usage, by calendar months and
 * under a voyage plan, the stagger proposal on a fixture with one feasible arrangement, infeasible answers with
 * their reasons, approval into the voyage plan's limits, alerts sent once, and who may do what.
 *
 * Every expected figure is hand-computed from the fixture below (the arithmetic is written out beside each check);
 * the counting rule (hours since = meter hours after the work, across a replaced meter) is common practice, as is
 * "whichever comes first" for an interval in hours and months. Dates are added with the JavaScript Date of the
 * ECMAScript specification (UTC), independently of the project's day numbering.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fuelPrices, gensetDailyLogs, gensetMaintenance, gensets, maintenanceEvents, meterReplacements, subscriptions, users, voyagePlans } from '../../server/db/schema';
import type { HourBudgetPlan, StaggerResult, VesselOverhaul, FleetOverhaul } from '../../shared/schemas/overhaul';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

const TOL_H = 1e-6; // hours: sums of exact decimal readings
const TOL_RATE = 1e-6; // h/day
const TOL_KG = 1e-3; // kg over 181 days at ~230 kg/h

/** date + n days (UTC), YYYY-MM-DD. */
function plusDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}
function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

let app: TestApp;
let a: Tenant;
let b: Tenant;
const clients = {} as Record<'admin' | 'superintendent' | 'chief' | 'energy' | 'planner' | 'otherAdmin' | 'otherPlanner', HttpClient>;
let vesselOne: string;
let vesselTwo: string;
let dg1: string;
let dg2: string;
const staggerSets: Record<string, string> = {};

async function insertSet(vesselId: string, designation: string, p75 = 200): Promise<string> {
  const [g] = await app.database.db
    .insert(gensets)
    .values({
      vesselId,
      designation,
      ratedKw: 1000,
      ratedKva: 1250,
      voltageV: 440,
      frequencyHz: 60,
      speedClass: 'medium',
      minLoadPct: 30,
      maxLoadPct: 100,
      shopTestSfoc: { p25: null, p50: null, p75, p85: null, p100: null },
    })
    .returning();
  return g.id;
}

async function readings(gensetId: string, rows: [string, number][]): Promise<void> {
  await app.database.db.insert(gensetDailyLogs).values(rows.map(([logDate, runningHoursMeter]) => ({ gensetId, logDate, runningHoursMeter })));
}

/*
 * Vessel One.
 * DG1: hour meter 9100 h on 2026-03-02; 9640 + 12·(d − 1) h on 1–20 May (9868 on 20 May); the meter was replaced on
 *   21 May (old meter's final 9874 h, new meter from 0), new meter 6 + 12·(d − 21) h on 21–31 May (126 h on 31 May).
 *   Equivalent reading on 31 May = 126 + 9874 − 0 = 10 000 h.
 *   top overhaul every 12 000 h, register: last done at 6000 h on 2026-01-10
 *     → hours since 10 000 − 6000 = 4000, left 8000, due at 18 000 equivalent = 18 000 − 9874 = 8126 h on the new meter.
 *   major overhaul every 24 000 h or 24 months, register: 2000 h on 2025-03-15
 *     → since 8000, left 16 000; by months 2027-03-15, by hours far later: due 2027-03-15, 288 days after 31 May.
 *   Usage over 30 days (1 May → 31 May): (10 000 − 9640)/30 = 12 h/day; over 90 days (2 Mar → 31 May): 900/90 = 10.
 *   Top overhaul recorded partway, on 2026-05-11 at 9760 h (the old meter's reading that day)
 *     → since 10 000 − 9760 = 240, left 11 760, due at 9760 + 12 000 − 9874 = 11 886 h on the new meter.
 * DG2: 700 h on 1 May, 940 h on 31 May (8 h/day); top overhaul every 1000 h from 0 h on 2026-01-01 → 60 h left.
 */
async function seedVesselOne(): Promise<void> {
  const db = app.database.db;
  dg1 = await insertSet(vesselOne, 'DG1');
  dg2 = await insertSet(vesselOne, 'DG2');
  const rows: [string, number][] = [['2026-03-02', 9100]];
  for (let d = 1; d <= 20; d++) rows.push([`2026-05-${String(d).padStart(2, '0')}`, 9640 + 12 * (d - 1)]);
  for (let d = 21; d <= 31; d++) rows.push([`2026-05-${d}`, 6 + 12 * (d - 21)]);
  await readings(dg1, rows);
  await db.insert(meterReplacements).values({ gensetId: dg1, meter: 'running_hours', replacedOn: '2026-05-21', oldFinalReading: 9874, newStartReading: 0 });
  await db.insert(meterReplacements).values({ gensetId: dg1, meter: 'kwh', replacedOn: '2026-05-25', oldFinalReading: 5e6, newStartReading: 0 });
  await db.insert(gensetMaintenance).values([
    { gensetId: dg1, kind: 'top overhaul', intervalHours: 12_000, lastDoneRunningHours: 6000, lastDoneOn: '2026-01-10' },
    { gensetId: dg1, kind: 'major overhaul', intervalHours: 24_000, intervalMonths: 24, lastDoneRunningHours: 2000, lastDoneOn: '2025-03-15' },
  ]);
  await readings(dg2, [
    ['2026-05-01', 700],
    ['2026-05-31', 940],
  ]);
  await db.insert(gensetMaintenance).values({ gensetId: dg2, kind: 'top overhaul', intervalHours: 1000, lastDoneRunningHours: 0, lastDoneOn: '2026-01-01' });
}

/*
 * Vessel Two: the stagger fixture (hand-computed; no published case exists). Four sets, each 2000 h meter on
 * 2026-12-02 and 2270 h on 2027-01-01 (9 h/day), top overhaul every 2000 h done at 270 + H h so that H h are left
 * on 2027-01-01: H = 1100, 200, 400, 1000. Fuel per running hour from the shop-test SFOC at 75 % × 0.75 × 1000 kW
 * (no fuel logged): p75 = f/0.75 for f = 220, 235, 228, 241 kg/h. The plant needs 9 + 9 + 9 + 9 = 36 set-hours
 * per day. Windows (days after 1 Jan): W1 20–22, W2 45–48, W3 90–92, W4 140–145; gap 14 days; until 2027-07-01
 * (181 days). A due on day k needs a rate r with H/k ≤ r < H/(k − 1); each window is shorter than the gap, so the
 * four dues take one window each, and of the 4! placements only DG1→W4, DG2→W1, DG3→W2, DG4→W3 lets the rates
 * add to 36: lower ends 1100/145 + 200/22 + 400/48 + 1000/92 = 35.880014 ≤ 36 < the upper ends' sum.
 * Least fuel: DG2, DG3, DG4 at their lower ends, the cheapest DG1 (220 kg/h) takes the rest: r1 = 36 − 200/22 −
 * 400/48 − 1000/92 = 7.706193 h/day, due day ⌈1100/7.706193⌉ = 143 = 2027-05-24 (in W4); DG2 day 22 (2027-01-23),
 * DG3 day 48 (2027-02-18), DG4 day 92 (2027-04-03). Fuel delta = Σ f·181·(r − 9) kg.
 */
const STAGGER = {
  hoursLeft: { DG1: 1100, DG2: 200, DG3: 400, DG4: 1000 } as Record<string, number>,
  fuelKgPerH: { DG1: 220, DG2: 235, DG3: 228, DG4: 241 } as Record<string, number>,
  windows: [
    { place: 'Port A', startsOn: '2027-01-21', endsOn: '2027-01-23' },
    { place: 'Port B', startsOn: '2027-02-15', endsOn: '2027-02-18' },
    { place: 'Port C', startsOn: '2027-04-01', endsOn: '2027-04-03' },
    { place: 'Yard D', startsOn: '2027-05-21', endsOn: '2027-05-26' },
  ],
  windowOf: { DG1: 'Yard D', DG2: 'Port A', DG3: 'Port B', DG4: 'Port C' } as Record<string, string>,
  dueDate: { DG1: '2027-05-24', DG2: '2027-01-23', DG3: '2027-02-18', DG4: '2027-04-03' } as Record<string, string>,
  rate: { DG1: 36 - 200 / 22 - 400 / 48 - 1000 / 92, DG2: 200 / 22, DG3: 400 / 48, DG4: 1000 / 92 } as Record<string, number>,
  horizonDays: 181,
  pricePerT: 600,
};

async function seedVesselTwo(): Promise<void> {
  const db = app.database.db;
  for (const name of ['DG1', 'DG2', 'DG3', 'DG4']) {
    const id = await insertSet(vesselTwo, name, STAGGER.fuelKgPerH[name] / 0.75);
    staggerSets[name] = id;
    await readings(id, [
      ['2026-12-02', 2000],
      ['2027-01-01', 2270],
    ]);
    await db.insert(gensetMaintenance).values({ gensetId: id, kind: 'top overhaul', intervalHours: 2000, lastDoneRunningHours: 270 + STAGGER.hoursLeft[name], lastDoneOn: '2026-06-01' });
  }
  // Vessel Two burns MGO only (createTenant); the company's MGO price prices the fuel delta.
  await db.insert(fuelPrices).values({ companyId: a.companyId, grade: 'MGO', pricePerT: STAGGER.pricePerT, validFrom: '2026-01-01' });
}

beforeAll(async () => {
  app = await startTestApp();
  app.advance(Date.parse('2027-01-05T12:00:00Z') - Date.now());
  a = await createTenant(app, 'Kittiwake Lines');
  b = await createTenant(app, 'Fulmar Shipping');
  [vesselOne, vesselTwo] = a.vesselIds;
  await seedVesselOne();
  await seedVesselTwo();
  const logins: [keyof typeof clients, string][] = [
    ['admin', a.emails.admin],
    ['superintendent', a.emails.superintendent],
    ['chief', a.emails.chief_engineer],
    ['energy', a.emails.energy_officer],
    ['planner', a.emails.planner],
    ['otherAdmin', b.emails.admin],
    ['otherPlanner', b.emails.planner],
  ];
  for (const [key, email] of logins) {
    clients[key] = app.client();
    expect((await clients[key].signIn(email)).status).toBe(200);
  }
}, 60_000);
afterAll(() => app?.close());

const overhaulOf = (c: HttpClient, vesselId: string, q = '') => c.get<VesselOverhaul>(`/api/vessels/${vesselId}/overhaul${q}`);
const itemOf = (o: VesselOverhaul, gensetId: string, kind: string) => o.sets.find((s) => s.gensetId === gensetId)!.items.find((i) => i.kind === kind)!;

describe('hours since and due dates', () => {
  it('counts across the replaced meter from the register, at 30 days of usage', async () => {
    const res = await overhaulOf(clients.energy, vesselOne);
    expect(res.status).toBe(200);
    const set = res.body.sets.find((s) => s.gensetId === dg1)!;
    expect(set.asOfDate).toBe('2026-05-31');
    expect(set.latestMeterH).toBe(126);
    expect(set.usage.hPerDay!).toBeCloseTo(12, 9); // (10 000 − 9640)/30
    const top = itemOf(res.body, dg1, 'top overhaul');
    expect(top.basis).toBe('recorded');
    expect(Math.abs(top.hoursSince - 4000)).toBeLessThan(TOL_H);
    expect(Math.abs(top.hoursLeft - 8000)).toBeLessThan(TOL_H);
    expect(Math.abs(top.dueAtMeterReadingH - 8126)).toBeLessThan(TOL_H);
    // 8000 h at 12 h/day: ⌈666.67⌉ = 667 days after 31 May
    expect(top.dueByHoursDate).toBe(plusDays('2026-05-31', 667));
    expect(top.governedBy).toBe('hours');
  });

  it('lets the calendar interval govern when it comes first', async () => {
    const major = itemOf((await overhaulOf(clients.energy, vesselOne)).body, dg1, 'major overhaul');
    expect(Math.abs(major.hoursLeft - 16000)).toBeLessThan(TOL_H);
    expect(major.dueByMonthsDate).toBe('2027-03-15');
    expect(major.dueDate).toBe('2027-03-15');
    expect(major.governedBy).toBe('months');
    expect(major.daysLeft).toBe(daysBetween('2026-05-31', '2027-03-15'));
    expect(major.daysLeft).toBe(288); // 30+31+31+30+31+30+31+31+28+15
  });

  it('uses the 90-day window when chosen', async () => {
    const res = await overhaulOf(clients.energy, vesselOne, '?windowDays=90');
    expect(res.body.sets.find((s) => s.gensetId === dg1)!.usage.hPerDay!).toBeCloseTo(10, 9); // 900/90
    expect(itemOf(res.body, dg1, 'top overhaul').dueByHoursDate).toBe(plusDays('2026-05-31', 800)); // 8000/10
    expect((await overhaulOf(clients.energy, vesselOne, '?windowDays=45')).status).toBe(422);
  });

  it('forecasts under a saved voyage plan (its hours, then the recent rate)', async () => {
    // The plan runs DG2 alone for 36 h from 1 June 00:00: 24 h on 1 June and 12 h on 2 June; DG1 is idle both days.
    const [plan] = await app.database.db
      .insert(voyagePlans)
      .values({
        vesselId: vesselOne,
        name: 'Short leg',
        status: 'solved',
        inputs: {},
        result: { status: 'optimal', periods: [{ startH: 0, durationH: 36, mode: 'sea', loadKw: 600, runningIds: [dg2], loadsKw: [600], fuelKg: 0 }] },
      })
      .returning();
    const res = await overhaulOf(clients.energy, vesselOne, `?usage=plan&planId=${plan.id}`);
    expect(res.status).toBe(200);
    expect(res.body.planStartDate).toBe('2026-06-01');
    // DG2: 60 h left; 36 h by the end of 2 June, 24 h more at 8 h/day: 3 days → 5 June (at 8 h/day alone: 8 June)
    expect(itemOf(res.body, dg2, 'top overhaul').dueByHoursDate).toBe('2026-06-05');
    expect(itemOf((await overhaulOf(clients.energy, vesselOne)).body, dg2, 'top overhaul').dueByHoursDate).toBe('2026-06-08');
    // DG1: 0 h on 1–2 June, then 12 h/day: 2 June + 667 days
    expect(itemOf(res.body, dg1, 'top overhaul').dueByHoursDate).toBe(plusDays('2026-06-02', 667));
    expect((await overhaulOf(clients.energy, vesselOne, '?usage=plan')).status).toBe(422);
  });

  it('records a top overhaul partway and counts from it (chief engineer, own vessel)', async () => {
    const bad = await clients.chief.post(`/api/vessels/${vesselOne}/maintenance-events`, { gensetId: dg1, kind: 'top overhaul', doneOn: '2026-05-11', runningHours: 9000 });
    expect(bad.status).toBe(422); // 9748 h was logged the day before
    const future = await clients.chief.post(`/api/vessels/${vesselOne}/maintenance-events`, { gensetId: dg1, kind: 'top overhaul', doneOn: '2027-02-01', runningHours: 200 });
    expect(future.status).toBe(422);
    const res = await clients.chief.post(`/api/vessels/${vesselOne}/maintenance-events`, { gensetId: dg1, kind: 'Top overhaul', doneOn: '2026-05-11', runningHours: 9760 });
    expect(res.status).toBe(201);
    expect(res.body.kind).toBe('top overhaul'); // the register's spelling
    const top = itemOf((await overhaulOf(clients.energy, vesselOne)).body, dg1, 'top overhaul');
    expect(top.lastDoneOn).toBe('2026-05-11');
    expect(Math.abs(top.hoursSince - 240)).toBeLessThan(TOL_H);
    expect(Math.abs(top.hoursLeft - 11760)).toBeLessThan(TOL_H);
    expect(Math.abs(top.dueAtMeterReadingH - 11886)).toBeLessThan(TOL_H);
    expect(top.dueByHoursDate).toBe(plusDays('2026-05-31', 980)); // 11 760/12 = 980 exactly
    // the curves service reads the same row to open a new post-overhaul window
    const events = await app.database.db.select().from(maintenanceEvents).where(eq(maintenanceEvents.gensetId, dg1));
    expect(events.map((e) => [e.kind, e.doneOn, e.runningHours])).toEqual([['top overhaul', '2026-05-11', 9760]]);
    const list = await clients.energy.get(`/api/vessels/${vesselOne}/maintenance-events`);
    expect(list.body).toHaveLength(1);
  });

  it('lists every set of every vessel by due date on the fleet page', async () => {
    const res = await clients.energy.get<FleetOverhaul>('/api/fleet/overhaul');
    expect(res.status).toBe(200);
    const dates = res.body.rows.map((r) => r.dueDate ?? '9999');
    expect([...dates].sort()).toEqual(dates);
    expect(res.body.rows[0]).toMatchObject({ gensetId: dg2, kind: 'top overhaul' }); // 8 June 2026 comes first
    expect(res.body.rows.filter((r) => r.vesselId === vesselTwo)).toHaveLength(4);
    const otherCompany = await clients.otherAdmin.get<FleetOverhaul>('/api/fleet/overhaul');
    expect(otherCompany.body.rows).toHaveLength(0);
  });
});

describe('work windows and stagger advice', () => {
  it('lets planners keep windows; others read them', async () => {
    for (const w of STAGGER.windows) {
      const res = await clients.planner.post(`/api/vessels/${vesselTwo}/work-windows`, { kind: w.place.startsWith('Yard') ? 'dry_dock' : 'port_call', ...w });
      expect(res.status).toBe(201);
    }
    const extra = await clients.superintendent.post(`/api/vessels/${vesselTwo}/work-windows`, { kind: 'port_call', place: 'Spare', startsOn: '2027-09-01', endsOn: '2027-08-30' });
    expect(extra.status).toBe(422);
    const tmp = await clients.superintendent.post(`/api/vessels/${vesselTwo}/work-windows`, { kind: 'port_call', place: 'Spare', startsOn: '2027-09-01', endsOn: '2027-09-02' });
    expect(tmp.status).toBe(201);
    const moved = await clients.planner.patch(`/api/vessels/${vesselTwo}/work-windows/${tmp.body.id}`, { kind: 'port_call', place: 'Spare', startsOn: '2027-09-03', endsOn: '2027-09-04' });
    expect(moved.body.startsOn).toBe('2027-09-03');
    expect((await clients.planner.delete(`/api/vessels/${vesselTwo}/work-windows/${tmp.body.id}`)).status).toBe(204);
    const list = await clients.energy.get(`/api/vessels/${vesselTwo}/work-windows`);
    expect(list.body.map((w: { place: string }) => w.place)).toEqual(['Port A', 'Port B', 'Port C', 'Yard D']);
  });

  it('proposes the one arrangement that meets the gap and the windows, at the least fuel', async () => {
    const res = await clients.planner.post<StaggerResult>(`/api/vessels/${vesselTwo}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 14 });
    expect(res.status).toBe(200);
    const p = res.body;
    expect(p.status).toBe('in-windows');
    expect(p.fromDate).toBe('2027-01-01');
    expect(p.horizonDays).toBe(STAGGER.horizonDays);
    expect(p.requiredSetHoursPerDay).toBeCloseTo(36, 9);
    let deltaKg = 0;
    for (const budget of p.budgets) {
      const name = budget.designation;
      expect(budget.dueDate).toBe(STAGGER.dueDate[name]);
      expect(budget.windowLabel).toContain(STAGGER.windowOf[name]);
      expect(Math.abs(budget.hPerDay - STAGGER.rate[name])).toBeLessThan(TOL_RATE);
      expect(Math.abs(budget.budgetH - STAGGER.rate[name] * 181)).toBeLessThan(TOL_RATE * 181);
      expect(Math.abs(p.hourBudgets[staggerSets[name]] - budget.budgetH)).toBeLessThan(TOL_H);
      expect(Math.abs(budget.fuelKgPerH - STAGGER.fuelKgPerH[name])).toBeLessThan(1e-9);
      deltaKg += STAGGER.fuelKgPerH[name] * 181 * (STAGGER.rate[name] - 9);
    }
    expect(Math.abs(p.fuelDeltaKg - deltaKg)).toBeLessThan(TOL_KG);
    expect(p.fuelGrade).toBe('MGO');
    expect(Math.abs((p.costDelta ?? NaN) - (deltaKg / 1000) * STAGGER.pricePerT)).toBeLessThan(TOL_KG);
  });

  it('answers infeasible requests with the reason', async () => {
    const tooMuch = await clients.planner.post<StaggerResult>(`/api/vessels/${vesselTwo}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 14, requiredSetHoursPerDay: 100 });
    expect(tooMuch.status).toBe(200);
    expect(tooMuch.body.status).toBe('infeasible');
    expect(tooMuch.body.reasons.join('\n')).toMatch(/at most 96 set-hours per day; the plant needs 100/); // 4 × 24
    // A 60-day gap: four dues cannot sit in the four windows (W1→W2 is 25 days); DG1 (1100 h) cannot make Port A
    // by day 22 (1100/22 = 50 h/day > 24).
    const wide = await clients.planner.post<StaggerResult>(`/api/vessels/${vesselTwo}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 60 });
    expect(wide.body.status).not.toBe('in-windows');
    const reasons = wide.body.reasons.join('\n');
    expect(reasons).toMatch(/DG1 cannot make Port call Port A.*at least 50 h\/day, above its 24 h\/day/);
    expect(reasons).toMatch(/cannot hold the due dates 60 days apart/);
    expect(reasons).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-/); // sets named by designation, not id
  });

  it('saves a proposal, approves it, supersedes the earlier one, and the voyage plan reads it', async () => {
    const first = await clients.planner.post<HourBudgetPlan>(`/api/vessels/${vesselTwo}/hour-budgets`, { untilDate: '2027-07-01', minGapDays: 14 });
    expect(first.status).toBe(201);
    expect(first.body.status).toBe('proposed');
    expect((await clients.planner.post(`/api/vessels/${vesselTwo}/hour-budgets/${first.body.id}/approve`)).body.status).toBe('approved');
    const second = await clients.superintendent.post<HourBudgetPlan>(`/api/vessels/${vesselTwo}/hour-budgets`, { untilDate: '2027-07-01', minGapDays: 7 });
    const approved = await clients.superintendent.post<HourBudgetPlan>(`/api/vessels/${vesselTwo}/hour-budgets/${second.body.id}/approve`);
    expect(approved.status).toBe(200);
    expect(approved.body.approvedBy).toContain('superintendent');
    const list = await clients.energy.get<HourBudgetPlan[]>(`/api/vessels/${vesselTwo}/hour-budgets`);
    expect(Object.fromEntries(list.body.map((p) => [p.id, p.status]))).toEqual({ [first.body.id]: 'superseded', [second.body.id]: 'approved' });
    expect((await clients.superintendent.post(`/api/vessels/${vesselTwo}/hour-budgets/${first.body.id}/approve`)).status).toBe(409);
    const infeasible = await clients.planner.post<HourBudgetPlan>(`/api/vessels/${vesselTwo}/hour-budgets`, { untilDate: '2027-07-01', minGapDays: 14, requiredSetHoursPerDay: 100 });
    expect((await clients.planner.post(`/api/vessels/${vesselTwo}/hour-budgets/${infeasible.body.id}/approve`)).status).toBe(409);
    // The voyage-plan service's reader: the latest approved row's result.hourBudgets over result.horizonDays.
    const stored = second.body.result;
    expect(stored.horizonDays).toBe(181);
    expect(Object.keys(stored.hourBudgets).sort()).toEqual(Object.values(staggerSets).sort());
  });
});

describe('overhaul alerts', () => {
  it('mails a subscriber once when a set comes within the hours, however often the check runs', async () => {
    const [energy] = await app.database.db.select().from(users).where(eq(users.email, a.emails.energy_officer));
    await app.database.db.insert(subscriptions).values({ companyId: a.companyId, userId: energy.id, kind: 'overhaul_alert', vesselId: vesselOne, hoursBefore: 100 });
    const first = await clients.admin.post('/api/overhaul/alerts/check');
    expect(first.status).toBe(200);
    expect(first.body.sent).toBe(1); // DG2 with 60 h left; DG1's 11 760 and 16 000 h are not within 100 h
    const second = await clients.admin.post('/api/overhaul/alerts/check');
    expect(second.body.sent).toBe(0);
    const mail = await app.mail.waitFor((m) => m.subject.includes('DG2') && m.subject.includes('top overhaul'));
    expect(mail.text).toContain('falls due in 60 running hours');
    await new Promise((r) => setTimeout(r, 300));
    expect(app.mail.messages.filter((m) => m.subject.includes('top overhaul of Kittiwake Lines One DG2'))).toHaveLength(1);
    expect((await clients.planner.post('/api/overhaul/alerts/check')).status).toBe(403);
  });
});

describe('roles and company isolation', () => {
  const window = { kind: 'port_call', place: 'X', startsOn: '2027-10-01', endsOn: '2027-10-02' };
  const work = () => ({ gensetId: dg2, kind: 'top overhaul', doneOn: '2026-05-31', runningHours: 940 });

  it('keeps the energy officer read-only', async () => {
    expect((await overhaulOf(clients.energy, vesselTwo)).status).toBe(200);
    expect((await clients.energy.post(`/api/vessels/${vesselTwo}/work-windows`, window)).status).toBe(403);
    expect((await clients.energy.post(`/api/vessels/${vesselOne}/maintenance-events`, work())).status).toBe(403);
    expect((await clients.energy.post(`/api/vessels/${vesselTwo}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 14 })).status).toBe(403);
    expect((await clients.energy.post(`/api/vessels/${vesselTwo}/hour-budgets`, { untilDate: '2027-07-01', minGapDays: 14 })).status).toBe(403);
  });

  it('lets chief engineers record work on their own vessels only, and not plan', async () => {
    const elsewhere = await clients.chief.post(`/api/vessels/${vesselTwo}/maintenance-events`, { gensetId: staggerSets.DG1, kind: 'top overhaul', doneOn: '2027-01-01', runningHours: 2270 });
    expect(elsewhere.status).toBe(404);
    expect((await overhaulOf(clients.chief, vesselTwo)).status).toBe(404);
    expect((await clients.chief.post(`/api/vessels/${vesselOne}/work-windows`, window)).status).toBe(403);
    expect((await clients.planner.post(`/api/vessels/${vesselOne}/maintenance-events`, work())).status).toBe(403);
    expect((await clients.admin.post(`/api/vessels/${vesselTwo}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 14 })).status).toBe(403);
    const ok = await clients.superintendent.post(`/api/vessels/${vesselOne}/maintenance-events`, work());
    expect(ok.status).toBe(201);
  });

  it('never shows or changes another company’s vessels', async () => {
    expect((await overhaulOf(clients.otherAdmin, vesselOne)).status).toBe(404);
    expect((await clients.otherPlanner.post(`/api/vessels/${vesselTwo}/work-windows`, window)).status).toBe(404);
    expect((await clients.otherPlanner.get(`/api/vessels/${vesselTwo}/hour-budgets`)).status).toBe(404);
    const plans = await clients.planner.get<HourBudgetPlan[]>(`/api/vessels/${vesselTwo}/hour-budgets`);
    expect((await clients.otherPlanner.post(`/api/vessels/${vesselTwo}/hour-budgets/${plans.body[0].id}/approve`)).status).toBe(404);
    expect((await clients.otherPlanner.post(`/api/vessels/${vesselOne}/overhaul/stagger`, { untilDate: '2027-07-01', minGapDays: 14 })).status).toBe(404);
  });
});
