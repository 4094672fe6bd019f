/**
 * What a fuel-curve fit reads from the database for the sets of one vessel: every stored day derived exactly as
 * the log table derives it (logs-data / logs-derive, which call optimizer/logs deriveGensetSeries), the vessel's
 * mode hours (to leave out shore-power-only days) and the overhauls that open a new curve window.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { CURVE_RESET_KINDS } from '../../shared/schemas/curves';
import type { DbOrTx } from '../db/client';
import { gensets, maintenanceEvents, vesselModeHours } from '../db/schema';
import { loadStoredLogs, loadVesselLogContext, rawOf } from './logs-data';
import { deriveSetDays } from './logs-derive';

/** One stored day of one set with what the fit needs to decide whether and how it enters. */
export interface CurveInputDay {
  logId: string;
  date: string;
  excluded: boolean;
  /** Derived without an error flag and with fuel logged. */
  usable: boolean;
  /** The whole day on shore power (vessel mode hours). */
  shorePowerOnly: boolean;
  hoursRun: number | null;
  avgLoadKw: number | null;
  /** Fuel of the day referred to the ISO 3046-1 LCV, kg. */
  fuelKgIso: number | null;
}

export interface CurveInputOverhaul {
  kind: string;
  doneOn: string;
  runningHours: number;
}

export interface CurveInputSet {
  id: string;
  designation: string;
  ratedKw: number;
  duty: string;
  shopTestSfoc: { p25: number | null; p50: number | null; p75: number | null; p85: number | null; p100: number | null };
  /** Every stored day, oldest first. */
  days: CurveInputDay[];
  /** Overhauls of a kind in CURVE_RESET_KINDS, oldest first. */
  overhauls: CurveInputOverhaul[];
}

const RESET = new Set<string>(CURVE_RESET_KINDS);

/** True when a maintenance kind starts a new curve window (see CURVE_RESET_KINDS). */
export function resetsCurve(kind: string): boolean {
  return RESET.has(kind.trim().toLowerCase());
}

/**
 * The curve inputs of a vessel's sets (all of them, or only `gensetId`). Reads every stored day of each set so
 * that cumulative meter readings chain as in the log table; windows are cut afterwards.
 */
export async function loadCurveInputs(db: DbOrTx, vesselId: string, gensetId?: string): Promise<CurveInputSet[]> {
  const ctx = await loadVesselLogContext(db, vesselId);
  const sets = ctx.sets.filter((s) => !gensetId || s.id === gensetId);
  if (!sets.length) return [];
  const ids = sets.map((s) => s.id);
  const [stored, registers, modes, events] = await Promise.all([
    loadStoredLogs(db, ids),
    db.select({ id: gensets.id, shopTestSfoc: gensets.shopTestSfoc }).from(gensets).where(inArray(gensets.id, ids)),
    db.select().from(vesselModeHours).where(eq(vesselModeHours.vesselId, vesselId)),
    db
      .select()
      .from(maintenanceEvents)
      .where(and(inArray(maintenanceEvents.gensetId, ids)))
      .orderBy(asc(maintenanceEvents.doneOn), asc(maintenanceEvents.createdAt)),
  ]);
  const shorePowerOnly = new Set<string>();
  for (const m of modes) {
    const other = m.seaH + m.manoeuvringH + m.portH + m.anchorageH;
    if (m.shorePowerH > 0 && other <= 0) shorePowerOnly.add(m.logDate);
  }
  const shopById = new Map(registers.map((r) => [r.id, r.shopTestSfoc]));
  return sets.map((set) => {
    const mine = stored.filter((s) => s.gensetId === set.id).sort((a, b) => (a.logDate < b.logDate ? -1 : a.logDate > b.logDate ? 1 : 0));
    const { byDate } = deriveSetDays(
      set,
      mine.map((s) => ({ logDate: s.logDate, values: rawOf(s) })),
      ctx.lotsById,
      ctx.lotsByDate,
      ctx.replacements.get(set.id) ?? new Map(),
      { dayLengthsH: ctx.dayLengthsH },
    );
    const days: CurveInputDay[] = mine.map((s) => {
      const d = byDate.get(s.logDate)?.derived;
      return {
        logId: s.id,
        date: s.logDate,
        excluded: s.excludedFromFit,
        usable: d?.usable ?? false,
        shorePowerOnly: shorePowerOnly.has(s.logDate),
        hoursRun: d?.hoursRun ?? null,
        avgLoadKw: d?.avgLoadKw ?? null,
        fuelKgIso: d?.fuelKgIso ?? null,
      };
    });
    const overhauls = events
      .filter((e) => e.gensetId === set.id && resetsCurve(e.kind))
      .map((e) => ({ kind: e.kind, doneOn: e.doneOn, runningHours: e.runningHours }));
    return {
      id: set.id,
      designation: set.designation,
      ratedKw: set.ratedKw,
      duty: set.duty,
      shopTestSfoc: shopById.get(set.id) ?? { p25: null, p50: null, p75: null, p85: null, p100: null },
      days,
      overhauls,
    };
  });
}
