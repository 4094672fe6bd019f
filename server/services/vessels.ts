import { and, asc, eq, inArray, max, sql } from 'drizzle-orm';
import type { Genset, GensetInput, VesselDetail, VesselInput, VesselSummary, VesselUpdate } from '../../shared/schemas/vessels';
import { gensetInputSchema } from '../../shared/schemas/vessels';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { busSections, gensetDailyLogs, gensetMaintenance, gensets, vessels } from '../db/schema';
import { AppError, notFound } from '../errors';
import { vesselForActor } from './access';
import { recordAudit } from './audit';

type GensetRow = typeof gensets.$inferSelect;
type MaintenanceRow = typeof gensetMaintenance.$inferSelect;

function toGenset(g: GensetRow, maintenance: MaintenanceRow[], latestRunningHours: number | null): Genset {
  return {
    id: g.id,
    vesselId: g.vesselId,
    designation: g.designation,
    busSectionId: g.busSectionId,
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
    maintenance: maintenance
      .filter((m) => m.gensetId === g.id)
      .map((m) => ({
        id: m.id,
        kind: m.kind,
        intervalHours: m.intervalHours,
        intervalMonths: m.intervalMonths,
        lastDoneRunningHours: m.lastDoneRunningHours,
        lastDoneOn: m.lastDoneOn,
      })),
    latestRunningHours,
  };
}

export async function listVessels(deps: AppDeps, actor: Actor): Promise<VesselSummary[]> {
  const rows = await deps.db
    .select({
      vessel: vessels,
      gensetCount: sql<number>`count(${gensets.id}) filter (where ${gensets.duty} = 'service')`.mapWith(Number),
      installedKw: sql<number>`coalesce(sum(${gensets.ratedKw}) filter (where ${gensets.duty} = 'service'), 0)`.mapWith(Number),
    })
    .from(vessels)
    .leftJoin(gensets, eq(gensets.vesselId, vessels.id))
    .where(eq(vessels.companyId, actor.companyId))
    .groupBy(vessels.id)
    .orderBy(asc(vessels.name));
  const visible = rows.filter((r) => actor.vesselIds === null || actor.vesselIds.includes(r.vessel.id));
  const lastLogs = visible.length
    ? await deps.db
        .select({ vesselId: gensets.vesselId, last: max(gensetDailyLogs.logDate) })
        .from(gensetDailyLogs)
        .innerJoin(gensets, eq(gensets.id, gensetDailyLogs.gensetId))
        .where(inArray(gensets.vesselId, visible.map((r) => r.vessel.id)))
        .groupBy(gensets.vesselId)
    : [];
  const lastBy = new Map(lastLogs.map((l) => [l.vesselId, l.last]));
  return visible.map((r) => ({
    id: r.vessel.id,
    name: r.vessel.name,
    imoNumber: r.vessel.imoNumber,
    vesselType: r.vessel.vesselType,
    fuelGrades: r.vessel.fuelGrades,
    gensetCount: r.gensetCount,
    installedKw: r.installedKw,
    lastLogDate: lastBy.get(r.vessel.id) ?? null,
  }));
}

export async function getVessel(deps: AppDeps, actor: Actor, vesselId: string, db: DbOrTx = deps.db): Promise<VesselDetail> {
  const vessel = await vesselForActor(db, actor, vesselId);
  const sections = await db.select().from(busSections).where(eq(busSections.vesselId, vesselId)).orderBy(asc(busSections.sortOrder));
  const sets = await db.select().from(gensets).where(eq(gensets.vesselId, vesselId)).orderBy(asc(gensets.designation));
  const ids = sets.map((s) => s.id);
  const maintenance = ids.length ? await db.select().from(gensetMaintenance).where(inArray(gensetMaintenance.gensetId, ids)) : [];
  const latest = ids.length
    ? await db
        .select({ gensetId: gensetDailyLogs.gensetId, hours: max(gensetDailyLogs.runningHoursMeter) })
        .from(gensetDailyLogs)
        .where(inArray(gensetDailyLogs.gensetId, ids))
        .groupBy(gensetDailyLogs.gensetId)
    : [];
  const latestBy = new Map(latest.map((l) => [l.gensetId, l.hours]));
  const lastLog = ids.length
    ? (await db.select({ last: max(gensetDailyLogs.logDate) }).from(gensetDailyLogs).where(inArray(gensetDailyLogs.gensetId, ids)))[0].last
    : null;
  const service = sets.filter((s) => s.duty === 'service');
  return {
    id: vessel.id,
    name: vessel.name,
    imoNumber: vessel.imoNumber,
    vesselType: vessel.vesselType,
    fuelGrades: vessel.fuelGrades,
    gensetCount: service.length,
    installedKw: service.reduce((s, g) => s + g.ratedKw, 0),
    lastLogDate: lastLog,
    busSections: sections.map((b) => ({ id: b.id, name: b.name, sortOrder: b.sortOrder })),
    gensets: sets.map((g) => toGenset(g, maintenance, latestBy.get(g.id) ?? null)),
  };
}

export async function createVessel(deps: AppDeps, actor: Actor, input: VesselInput & { busSections: string[] }): Promise<VesselDetail> {
  const id = await deps.db.transaction(async (tx) => {
    const [clash] = await tx
      .select({ id: vessels.id })
      .from(vessels)
      .where(and(eq(vessels.companyId, actor.companyId), eq(vessels.imoNumber, input.imoNumber)));
    if (clash) throw new AppError('conflict', `A vessel with number ${input.imoNumber} is registered already`, [{ path: 'imoNumber', message: 'Already registered' }]);
    const [vessel] = await tx
      .insert(vessels)
      .values({ companyId: actor.companyId, name: input.name, imoNumber: input.imoNumber, vesselType: input.vesselType, fuelGrades: input.fuelGrades })
      .returning();
    const names = [...new Set(input.busSections)];
    await tx.insert(busSections).values(names.map((name, i) => ({ vesselId: vessel.id, name, sortOrder: i })));
    await recordAudit(tx, actor, 'vessel', vessel.id, 'create', null, { ...vessel, busSections: names });
    return vessel.id;
  });
  return getVessel(deps, actor, id);
}

export async function updateVessel(deps: AppDeps, actor: Actor, vesselId: string, input: VesselUpdate): Promise<VesselDetail> {
  await deps.db.transaction(async (tx) => {
    const before = await vesselForActor(tx, actor, vesselId);
    const [after] = await tx
      .update(vessels)
      .set({ ...input, updatedAt: deps.now() })
      .where(eq(vessels.id, vesselId))
      .returning();
    await recordAudit(tx, actor, 'vessel', vesselId, 'update', before, after);
  });
  return getVessel(deps, actor, vesselId);
}

export async function deleteVessel(deps: AppDeps, actor: Actor, vesselId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const before = await vesselForActor(tx, actor, vesselId);
    await tx.delete(vessels).where(eq(vessels.id, vesselId));
    await recordAudit(tx, actor, 'vessel', vesselId, 'delete', before, null);
  });
}

export async function addBusSection(deps: AppDeps, actor: Actor, vesselId: string, name: string) {
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const existing = await tx.select().from(busSections).where(eq(busSections.vesselId, vesselId));
    if (existing.some((b) => b.name === name)) throw new AppError('conflict', `Bus section ${name} exists already`, [{ path: 'name', message: 'Exists already' }]);
    const [row] = await tx.insert(busSections).values({ vesselId, name, sortOrder: existing.length }).returning();
    await recordAudit(tx, actor, 'bus_section', row.id, 'create', null, row);
    return { id: row.id, name: row.name, sortOrder: row.sortOrder };
  });
}

async function checkGenset(tx: DbOrTx, vesselId: string, input: ReturnType<typeof gensetInputSchema.parse>, gensetId: string | null) {
  const [section] = input.busSectionId
    ? await tx
        .select()
        .from(busSections)
        .where(and(eq(busSections.id, input.busSectionId), eq(busSections.vesselId, vesselId)))
    : [];
  if (input.busSectionId && !section) throw new AppError('validation_failed', 'Choose a bus section of this vessel', [{ path: 'busSectionId', message: 'Not a bus section of this vessel' }]);
  const sameName = await tx
    .select({ id: gensets.id })
    .from(gensets)
    .where(and(eq(gensets.vesselId, vesselId), eq(gensets.designation, input.designation)));
  if (sameName.some((s) => s.id !== gensetId)) {
    throw new AppError('conflict', `This vessel has a set called ${input.designation} already`, [{ path: 'designation', message: 'Already used on this vessel' }]);
  }
}

function gensetValues(input: ReturnType<typeof gensetInputSchema.parse>) {
  const { maintenance: _maintenance, ...values } = input;
  return values;
}

export async function createGenset(deps: AppDeps, actor: Actor, vesselId: string, raw: GensetInput): Promise<Genset> {
  const input = gensetInputSchema.parse(raw);
  const id = await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    await checkGenset(tx, vesselId, input, null);
    const [row] = await tx.insert(gensets).values({ vesselId, ...gensetValues(input) }).returning();
    if (input.maintenance.length) {
      await tx.insert(gensetMaintenance).values(input.maintenance.map((m) => ({ ...m, gensetId: row.id })));
    }
    await recordAudit(tx, actor, 'genset', row.id, 'create', null, { ...row, maintenance: input.maintenance });
    return row.id;
  });
  return getGenset(deps, actor, vesselId, id);
}

export async function updateGenset(deps: AppDeps, actor: Actor, vesselId: string, gensetId: string, raw: GensetInput): Promise<Genset> {
  const input = gensetInputSchema.parse(raw);
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(gensets).where(and(eq(gensets.id, gensetId), eq(gensets.vesselId, vesselId)));
    if (!before) throw notFound('Genset');
    await checkGenset(tx, vesselId, input, gensetId);
    const beforeMaintenance = await tx.select().from(gensetMaintenance).where(eq(gensetMaintenance.gensetId, gensetId));
    const [after] = await tx
      .update(gensets)
      .set({ ...gensetValues(input), updatedAt: deps.now() })
      .where(eq(gensets.id, gensetId))
      .returning();
    await tx.delete(gensetMaintenance).where(eq(gensetMaintenance.gensetId, gensetId));
    if (input.maintenance.length) {
      await tx.insert(gensetMaintenance).values(input.maintenance.map((m) => ({ ...m, gensetId })));
    }
    await recordAudit(tx, actor, 'genset', gensetId, 'update', { ...before, maintenance: beforeMaintenance }, { ...after, maintenance: input.maintenance });
  });
  return getGenset(deps, actor, vesselId, gensetId);
}

export async function deleteGenset(deps: AppDeps, actor: Actor, vesselId: string, gensetId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(gensets).where(and(eq(gensets.id, gensetId), eq(gensets.vesselId, vesselId)));
    if (!before) throw notFound('Genset');
    await tx.delete(gensets).where(eq(gensets.id, gensetId));
    await recordAudit(tx, actor, 'genset', gensetId, 'delete', before, null);
  });
}

async function getGenset(deps: AppDeps, actor: Actor, vesselId: string, gensetId: string): Promise<Genset> {
  const vessel = await getVessel(deps, actor, vesselId);
  const set = vessel.gensets.find((g) => g.id === gensetId);
  if (!set) throw notFound('Genset');
  return set;
}
