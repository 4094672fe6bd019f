/** Loading what log derivation needs for a vessel: its sets, fuel lots, meter replacements and stored days. */
import { and, asc, eq, gte, inArray, lte, sql } from 'drizzle-orm';
import type { MeterReplacement } from '../../optimizer/index';
import type { RawLogValues } from '../../shared/schemas/logs';
import type { DbOrTx } from '../db/client';
import { fuelLots, gensetDailyLogs, gensets, meterReplacements, vesselModeHours } from '../db/schema';
import type { LotInfo, SetInfo } from './logs-derive';

export type StoredLog = typeof gensetDailyLogs.$inferSelect;

export const RAW_FIELDS = ['runningHoursMeter', 'hoursRun', 'kwhMeter', 'kwh', 'fuelMassKg', 'fuelVolumeL', 'fuelTempC', 'fuelLotId', 'remarks'] as const satisfies readonly (keyof RawLogValues)[];

export function rawOf(row: Pick<StoredLog, (typeof RAW_FIELDS)[number]>): RawLogValues {
  return {
    runningHoursMeter: row.runningHoursMeter,
    hoursRun: row.hoursRun,
    kwhMeter: row.kwhMeter,
    kwh: row.kwh,
    fuelMassKg: row.fuelMassKg,
    fuelVolumeL: row.fuelVolumeL,
    fuelTempC: row.fuelTempC,
    fuelLotId: row.fuelLotId,
    remarks: row.remarks,
  };
}

/** Same value for comparison: numbers equal within 1e-9 relative (unit conversions), others strictly. */
export function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  return (a ?? null) === (b ?? null);
}

export interface VesselLogContext {
  sets: (SetInfo & { duty: string })[];
  setsById: Map<string, SetInfo & { duty: string }>;
  lotsById: Map<string, LotInfo>;
  lotsByDate: LotInfo[];
  /** Per set: 'meter|date' → replacement. */
  replacements: Map<string, Map<string, MeterReplacement>>;
  /** Ship's days that are not 24 h long (clocks changed), from the day's operating-mode hours. */
  dayLengthsH: Map<string, number>;
}

export async function loadVesselLogContext(db: DbOrTx, vesselId: string): Promise<VesselLogContext> {
  const sets = await db
    .select({ id: gensets.id, designation: gensets.designation, ratedKw: gensets.ratedKw, minLoadPct: gensets.minLoadPct, duty: gensets.duty })
    .from(gensets)
    .where(eq(gensets.vesselId, vesselId))
    .orderBy(asc(gensets.designation));
  const lots = await db.select().from(fuelLots).where(eq(fuelLots.vesselId, vesselId)).orderBy(asc(fuelLots.deliveredOn), asc(fuelLots.createdAt));
  const lotInfos: LotInfo[] = lots.map((l) => ({
    id: l.id,
    reference: l.reference,
    grade: l.grade,
    density15KgPerM3: l.density15KgPerM3,
    lcvMjPerKg: l.lcvMjPerKg,
    lcvEstimated: l.lcvEstimated,
    sulphurPct: l.sulphurPct,
    deliveredOn: l.deliveredOn,
  }));
  const reps = sets.length ? await db.select().from(meterReplacements).where(inArray(meterReplacements.gensetId, sets.map((s) => s.id))) : [];
  const replacements = new Map<string, Map<string, MeterReplacement>>();
  for (const r of reps) {
    const m = replacements.get(r.gensetId) ?? new Map<string, MeterReplacement>();
    m.set(`${r.meter}|${r.replacedOn}`, { oldFinalReading: r.oldFinalReading, newStartReading: r.newStartReading });
    replacements.set(r.gensetId, m);
  }
  // A day whose mode hours add to 23 or 25 h is a clock-change day; its sets may log that many hours.
  const oddDays = await db
    .select({
      logDate: vesselModeHours.logDate,
      totalH: sql<number>`${vesselModeHours.seaH} + ${vesselModeHours.manoeuvringH} + ${vesselModeHours.portH} + ${vesselModeHours.anchorageH} + ${vesselModeHours.shorePowerH}`.mapWith(Number),
    })
    .from(vesselModeHours)
    .where(
      and(
        eq(vesselModeHours.vesselId, vesselId),
        sql`abs(${vesselModeHours.seaH} + ${vesselModeHours.manoeuvringH} + ${vesselModeHours.portH} + ${vesselModeHours.anchorageH} + ${vesselModeHours.shorePowerH} - 24) between 0.5 and 4`,
      ),
    );
  return {
    dayLengthsH: new Map(oddDays.map((d) => [d.logDate, d.totalH])),
    sets,
    setsById: new Map(sets.map((s) => [s.id, s])),
    lotsById: new Map(lotInfos.map((l) => [l.id, l])),
    lotsByDate: lotInfos,
    replacements,
  };
}

/** Stored days of the given sets between two dates (inclusive; either may be open). */
export async function loadStoredLogs(db: DbOrTx, gensetIds: string[], from?: string, to?: string): Promise<StoredLog[]> {
  if (!gensetIds.length) return [];
  const conds = [inArray(gensetDailyLogs.gensetId, gensetIds)];
  if (from) conds.push(gte(gensetDailyLogs.logDate, from));
  if (to) conds.push(lte(gensetDailyLogs.logDate, to));
  return db.select().from(gensetDailyLogs).where(and(...conds));
}
