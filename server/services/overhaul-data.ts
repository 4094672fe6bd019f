/**
 * What the overhaul planner reads for the sets of a vessel: hour-meter readings (genset_daily_logs through the
 * log-intake readers), running-hour meter replacements, the maintenance register and the work done, turned into
 * optimizer/overhaul's records; and the status of each kind counted by optimizer/overhaul.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import { dayNumber } from '../../optimizer/index';
import { hoursSinceMaintenance } from '../../optimizer/overhaul/running-hours';
import { usageRate, type UsageRate } from '../../optimizer/overhaul/forecast';
import type { DatedMeterReplacement, GensetHoursRecord, MaintenanceDone, MaintenanceStatus } from '../../optimizer/overhaul/types';
import type { DbOrTx } from '../db/client';
import { gensetMaintenance, gensets, maintenanceEvents, workWindows } from '../db/schema';
import { loadStoredLogs, loadVesselLogContext } from './logs-data';

export interface SetHours {
  id: string;
  designation: string;
  duty: 'service' | 'emergency';
  ratedKw: number;
  shopTestSfoc: { p25: number | null; p50: number | null; p75: number | null; p85: number | null; p100: number | null };
  record: GensetHoursRecord;
  /** Status per kind on the latest reading; empty when `problem` is set or the set has no kinds. */
  statuses: MaintenanceStatus[];
  problem: string | null;
}

/**
 * The register's "last done" as work done. Without a date, the work is placed on the date of the latest reading
 * at or below the register's hours (or the day before the first reading when every reading is above it).
 */
function registerDone(kind: string, hours: number | null, on: string | null, record: GensetHoursRecord): MaintenanceDone | null {
  if (hours === null) return null;
  if (on) return { kind, doneOn: on, readingH: hours };
  const sorted = [...record.readings].sort((a, b) => dayNumber(a.date) - dayNumber(b.date));
  if (!sorted.length) return null;
  const below = sorted.filter((r) => r.readingH <= hours);
  if (below.length) return { kind, doneOn: below[below.length - 1].date, readingH: hours };
  const first = new Date(`${sorted[0].date}T00:00:00Z`);
  first.setUTCDate(first.getUTCDate() - 1);
  return { kind, doneOn: first.toISOString().slice(0, 10), readingH: hours };
}

/** The hours records and statuses of a vessel's sets (all, or `gensetIds`), designation order. */
export async function loadSetHours(db: DbOrTx, vesselId: string, gensetIds?: string[]): Promise<SetHours[]> {
  const ctx = await loadVesselLogContext(db, vesselId);
  const sets = ctx.sets.filter((s) => !gensetIds || gensetIds.includes(s.id));
  if (!sets.length) return [];
  const ids = sets.map((s) => s.id);
  const [logs, registers, kinds, events] = await Promise.all([
    loadStoredLogs(db, ids),
    db.select({ id: gensets.id, shopTestSfoc: gensets.shopTestSfoc }).from(gensets).where(inArray(gensets.id, ids)),
    db.select().from(gensetMaintenance).where(inArray(gensetMaintenance.gensetId, ids)).orderBy(asc(gensetMaintenance.kind)),
    db.select().from(maintenanceEvents).where(inArray(maintenanceEvents.gensetId, ids)).orderBy(asc(maintenanceEvents.doneOn)),
  ]);
  const shopById = new Map(registers.map((r) => [r.id, r.shopTestSfoc]));
  return sets.map((set) => {
    const readings = logs
      .filter((l) => l.gensetId === set.id && l.runningHoursMeter !== null)
      .map((l) => ({ date: l.logDate, readingH: l.runningHoursMeter as number }));
    const replacements: DatedMeterReplacement[] = [];
    for (const [key, r] of ctx.replacements.get(set.id) ?? new Map()) {
      const [meter, date] = key.split('|');
      if (meter === 'running_hours') replacements.push({ date, oldFinalReading: r.oldFinalReading, newStartReading: r.newStartReading });
    }
    const mine = kinds.filter((k) => k.gensetId === set.id);
    const record: GensetHoursRecord = {
      gensetId: set.id,
      readings,
      replacements,
      kinds: mine.map((k) => ({ kind: k.kind, intervalHours: k.intervalHours, intervalMonths: k.intervalMonths })),
      done: [],
    };
    // Recorded events win over the register's figure of the same kind (the latest work of a kind counts).
    const done: MaintenanceDone[] = events
      .filter((e) => e.gensetId === set.id)
      .map((e) => ({ kind: mine.find((k) => k.kind.toLowerCase() === e.kind.toLowerCase())?.kind ?? e.kind, doneOn: e.doneOn, readingH: e.runningHours }));
    for (const k of mine) {
      const fromRegister = registerDone(k.kind, k.lastDoneRunningHours, k.lastDoneOn, record);
      if (fromRegister) done.push(fromRegister);
    }
    record.done = done;
    let statuses: MaintenanceStatus[] = [];
    let problem: string | null = null;
    if (!readings.length) problem = 'No running-hour meter readings logged yet';
    else if (mine.length) {
      try {
        statuses = hoursSinceMaintenance(record);
      } catch (err) {
        problem = err instanceof Error ? err.message : String(err);
      }
    }
    return {
      id: set.id,
      designation: set.designation,
      duty: set.duty as 'service' | 'emergency',
      ratedKw: set.ratedKw,
      shopTestSfoc: shopById.get(set.id) ?? { p25: null, p50: null, p75: null, p85: null, p100: null },
      record,
      statuses,
      problem,
    };
  });
}

/** Recent usage of a set (h/day over the window up to its latest reading); a problem reads as no rate. */
export function recentUsage(set: SetHours, windowDays: number): UsageRate {
  if (set.problem) return { ok: false, reason: set.problem };
  try {
    return usageRate(set.record.readings, set.record.replacements ?? [], { windowDays });
  } catch (err) {
    return { ok: false, reason: err instanceof Error ? err.message : String(err) };
  }
}

export async function windowsOfVessel(db: DbOrTx, vesselId: string) {
  return db.select().from(workWindows).where(eq(workWindows.vesselId, vesselId)).orderBy(asc(workWindows.startsOn), asc(workWindows.endsOn));
}
