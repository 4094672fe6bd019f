/**
 * Writes the demo scenario (seed/scenario.ts) into the database of server/db/schema.ts: one transaction,
 * multi-row inserts of up to 1 000 rows, the demo password hashed once with argon2id.
 */
import { randomUUID } from 'node:crypto';
import argon2 from 'argon2';
import type { PgInsertValue, PgTable } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../server/db/client';
import * as t from '../server/db/schema';
import { DEMO_PASSWORD, DEMO_SIGN_INS, generateScenario, type DemoScenario } from './scenario';

export { DEMO_PASSWORD, DEMO_SIGN_INS, generateScenario };
export type { DemoRole, DemoScenario, DemoSignIn, ScenarioOptions } from './scenario';

/** Rows per multi-row INSERT (14 columns × 1 000 rows stays far below PostgreSQL's 65 535 parameters). */
export const SEED_BATCH_ROWS = 1000;

export interface SeedDemoOptions {
  /** Password hasher; default argon2id with the library's default cost. Called once. */
  hashPassword?: (password: string) => Promise<string>;
  /** A scenario to write instead of the default one (e.g. another seed). */
  scenario?: DemoScenario;
}

export interface SeedDemoResult {
  companyId: string;
  /** Rows written per table. */
  rows: Record<string, number>;
}

const defaultHash = (password: string) => argon2.hash(password, { type: argon2.argon2id });

/**
 * true when the database holds no company (the demo is seeded only into an empty database).
 *
 * Cost: one indexed query. Throws when the query fails (e.g. migrations not applied).
 *
 * @example if (await isDatabaseEmpty(db)) await seedDemo(db);
 */
export async function isDatabaseEmpty(db: DbOrTx): Promise<boolean> {
  const rows = await db.select({ id: t.companies.id }).from(t.companies).limit(1);
  return rows.length === 0;
}

async function insertInBatches<T extends PgTable>(tx: DbOrTx, table: T, rows: PgInsertValue<T>[]): Promise<number> {
  for (let i = 0; i < rows.length; i += SEED_BATCH_ROWS) await tx.insert(table).values(rows.slice(i, i + SEED_BATCH_ROWS));
  return rows.length;
}

/**
 * Inserts the demo scenario: company, users and memberships (chief engineers vessel-scoped with
 * membership_vessels rows, everyone else unscoped), vessels, bus sections, gensets, maintenance, fuel lots, about
 * 10 000 daily genset logs and the vessels' mode hours. Everything in one transaction: all or nothing.
 *
 * Cost: one scenario generation (~0.1 s), one argon2id hash, about 20 INSERT statements (~1-2 s on a small
 * machine). Throws when the database already holds a company (seed only an empty database), or on any database
 * error (the transaction is rolled back).
 *
 * @example const { rows } = await seedDemo(db); rows.genset_daily_logs // ≈ 10 000
 */
export async function seedDemo(db: DbOrTx, options: SeedDemoOptions = {}): Promise<SeedDemoResult> {
  const scenario = options.scenario ?? generateScenario();
  const passwordHash = await (options.hashPassword ?? defaultHash)(DEMO_PASSWORD);
  const companyId = randomUUID();
  const userIds = new Map(scenario.users.map((u) => [u.key, randomUUID()]));
  const vesselIds = new Map(scenario.vessels.map((v) => [v.key, randomUUID()]));
  const lotIds = new Map(scenario.fuelLots.map((l) => [l.key, randomUUID()]));
  const gensetIds = new Map<string, string>();
  const sectionIds = new Map<string, string>();
  const rows: Record<string, number> = {};

  await db.transaction(async (tx) => {
    if (!(await isDatabaseEmpty(tx))) throw new Error('seedDemo requires an empty database (a company exists already)');
    rows.companies = await insertInBatches(tx, t.companies, [{ id: companyId, name: scenario.company.name, currency: scenario.company.currency }]);
    rows.users = await insertInBatches(
      tx,
      t.users,
      scenario.users.map((u) => ({ id: userIds.get(u.key) as string, email: u.email, name: u.name, passwordHash })),
    );
    const membershipIds = new Map(scenario.users.map((u) => [u.key, randomUUID()]));
    rows.memberships = await insertInBatches(
      tx,
      t.memberships,
      scenario.users.map((u) => ({
        id: membershipIds.get(u.key) as string,
        userId: userIds.get(u.key) as string,
        companyId,
        role: u.role,
        vesselScoped: u.vesselScope !== null,
      })),
    );
    rows.vessels = await insertInBatches(
      tx,
      t.vessels,
      scenario.vessels.map((v) => ({
        id: vesselIds.get(v.key) as string,
        companyId,
        name: v.name,
        imoNumber: v.imoNumber,
        vesselType: v.vesselType,
        fuelGrades: v.fuelGrades,
      })),
    );
    rows.membership_vessels = await insertInBatches(
      tx,
      t.membershipVessels,
      scenario.users.flatMap((u) =>
        (u.vesselScope ?? []).map((vesselKey) => ({ membershipId: membershipIds.get(u.key) as string, vesselId: vesselIds.get(vesselKey) as string })),
      ),
    );
    const sections = scenario.vessels.flatMap((v) =>
      v.busSections.map((b) => {
        const id = randomUUID();
        sectionIds.set(`${v.key}/${b.name}`, id);
        return { id, vesselId: vesselIds.get(v.key) as string, name: b.name, sortOrder: b.sortOrder };
      }),
    );
    rows.bus_sections = await insertInBatches(tx, t.busSections, sections);
    const sets = scenario.vessels.flatMap((v) => v.gensets);
    rows.gensets = await insertInBatches(
      tx,
      t.gensets,
      sets.map((g) => {
        const id = randomUUID();
        gensetIds.set(g.key, id);
        return {
          id,
          vesselId: vesselIds.get(g.vesselKey) as string,
          busSectionId: g.busSection === null ? null : (sectionIds.get(`${g.vesselKey}/${g.busSection}`) as string),
          designation: g.designation,
          ratedKw: g.ratedKw,
          ratedKva: g.ratedKva,
          voltageV: g.voltageV,
          frequencyHz: g.frequencyHz,
          speedClass: g.speedClass,
          minLoadPct: g.minLoadPct,
          maxLoadPct: g.maxLoadPct,
          startCostKg: g.startCostKg,
          minUpH: g.minUpH,
          minDownH: g.minDownH,
          shopTestSfoc: g.shopTestSfoc,
          duty: g.duty,
        };
      }),
    );
    rows.genset_maintenance = await insertInBatches(
      tx,
      t.gensetMaintenance,
      sets.flatMap((g) =>
        g.maintenance.map((m) => ({
          gensetId: gensetIds.get(g.key) as string,
          kind: m.kind,
          intervalHours: m.intervalHours,
          intervalMonths: m.intervalMonths,
          lastDoneRunningHours: m.lastDoneRunningHours,
          lastDoneOn: m.lastDoneOn,
        })),
      ),
    );
    rows.fuel_lots = await insertInBatches(
      tx,
      t.fuelLots,
      scenario.fuelLots.map((l) => ({
        id: lotIds.get(l.key) as string,
        vesselId: vesselIds.get(l.vesselKey) as string,
        reference: l.reference,
        grade: l.grade,
        density15KgPerM3: l.density15KgPerM3,
        lcvMjPerKg: l.lcvMjPerKg,
        lcvEstimated: l.lcvEstimated,
        sulphurPct: l.sulphurPct,
        quantityT: l.quantityT,
        deliveredOn: l.deliveredOn,
      })),
    );
    rows.genset_daily_logs = await insertInBatches(
      tx,
      t.gensetDailyLogs,
      scenario.logs.map((l) => ({
        gensetId: gensetIds.get(l.gensetKey) as string,
        logDate: l.logDate,
        runningHoursMeter: l.runningHoursMeter,
        kwhMeter: l.kwhMeter,
        fuelMassKg: l.fuelMassKg,
        fuelVolumeL: l.fuelVolumeL,
        fuelTempC: l.fuelTempC,
        fuelLotId: lotIds.get(l.fuelLotKey) as string,
        remarks: l.remarks,
      })),
    );
    rows.vessel_mode_hours = await insertInBatches(
      tx,
      t.vesselModeHours,
      scenario.modeHours.map((m) => ({
        vesselId: vesselIds.get(m.vesselKey) as string,
        logDate: m.logDate,
        seaH: m.seaH,
        manoeuvringH: m.manoeuvringH,
        portH: m.portH,
        anchorageH: m.anchorageH,
        shorePowerH: m.shorePowerH,
      })),
    );
    rows.meter_replacements = await insertInBatches(
      tx,
      t.meterReplacements,
      scenario.meterReplacements.map((r) => ({
        gensetId: gensetIds.get(r.gensetKey) as string,
        meter: r.meter,
        replacedOn: r.date,
        oldFinalReading: r.oldFinalReading,
        newStartReading: r.newStartReading,
        remarks: 'Energy meter replaced (demo scenario)',
      })),
    );
    rows.maintenance_events = await insertInBatches(
      tx,
      t.maintenanceEvents,
      scenario.overhaulEvents.map((e) => ({
        gensetId: gensetIds.get(e.gensetKey) as string,
        kind: e.kind,
        doneOn: e.date,
        runningHours: e.runningHours,
        remarks: 'Recorded from the demo scenario',
      })),
    );
    rows.operating_rules = await insertInBatches(
      tx,
      t.operatingRules,
      scenario.vessels.flatMap((v) => demoOperatingRules(vesselIds.get(v.key) as string, v.busSections.length > 1)),
    );
    rows.fuel_prices = await insertInBatches(tx, t.fuelPrices, demoFuelPrices(companyId, scenario.firstDate));
    rows.work_windows = await insertInBatches(
      tx,
      t.workWindows,
      scenario.vessels.flatMap((v, i) => demoWorkWindows(vesselIds.get(v.key) as string, i, scenario.lastDate)),
    );
  });
  return { companyId, rows };
}

/**
 * Spinning-reserve rules per mode (invented demo settings, typical of common practice: more reserve and two sets
 * with N-1 when manoeuvring, bus tie open when manoeuvring on a vessel with two sections).
 */
function demoOperatingRules(vesselId: string, twoSections: boolean) {
  return [
    { vesselId, mode: 'sea' as const, marginKw: 0, marginPct: 15, minSets: 1, nMinus1: false, busTieClosed: true },
    { vesselId, mode: 'manoeuvring' as const, marginKw: 0, marginPct: 30, minSets: 2, nMinus1: true, busTieClosed: !twoSections },
    { vesselId, mode: 'port' as const, marginKw: 0, marginPct: 10, minSets: 1, nMinus1: false, busTieClosed: true },
    { vesselId, mode: 'anchorage' as const, marginKw: 0, marginPct: 20, minSets: 1, nMinus1: false, busTieClosed: true },
  ];
}

/** Invented fuel prices (USD per tonne), two price periods per grade. */
function demoFuelPrices(companyId: string, firstDate: string) {
  const prices: Record<string, [number, number]> = { VLSFO: [612, 574], HFO: [468, 441], MGO: [768, 712] };
  return Object.entries(prices).flatMap(([grade, [first, second]]) => [
    { companyId, grade, pricePerT: first, validFrom: firstDate },
    { companyId, grade, pricePerT: second, validFrom: '2025-11-01' },
  ]);
}

/** Invented port calls and one dry dock after the log window, for the overhaul planner. */
function demoWorkWindows(vesselId: string, index: number, lastDate: string) {
  const base = new Date(`${lastDate}T00:00:00Z`).getTime();
  const day = (n: number) => new Date(base + n * 86_400_000).toISOString().slice(0, 10);
  const places = [
    ['Port Aldermere', 'Skerry Harbour', 'Vantby Roads', 'Calder Quay'],
    ['Saltmarsh Terminal', 'Port Aldermere', 'Holmwick', 'Ebbridge Yard'],
    ['Skerry Harbour', 'Holmwick', 'Vantby Roads', 'Ebbridge Yard'],
  ][index % 3];
  const offset = 9 + index * 5;
  return [
    { vesselId, kind: 'port_call' as const, place: places[0], startsOn: day(offset), endsOn: day(offset + 2) },
    { vesselId, kind: 'port_call' as const, place: places[1], startsOn: day(offset + 38), endsOn: day(offset + 40) },
    { vesselId, kind: 'port_call' as const, place: places[2], startsOn: day(offset + 81), endsOn: day(offset + 83) },
    { vesselId, kind: 'dry_dock' as const, place: places[3], startsOn: day(offset + 150), endsOn: day(offset + 171) },
  ];
}
