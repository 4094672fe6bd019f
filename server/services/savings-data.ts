/**
 * What the savings computation reads for one vessel and period: the plant (plant-model.ts: each set's current
 * since-overhaul fit, or its shop-test curve), each fit's coefficient covariance (curves service), the reserve
 * rule per mode, the vessel's mode hours, and every logged genset-day derived exactly as the log table derives it
 * (logs-data / logs-derive). Days that cannot be costed are listed with the reason instead.
 */
import { and, eq, gte, lte } from 'drizzle-orm';
import {
  dateOfDayNumber,
  dayNumber,
  FUEL_GRADES,
  OPERATING_MODES,
  type CurveUncertainty,
  type FuelGrade,
  type GensetUnit,
  type OperatingMode,
  type ReserveRule,
  type SavingsDay,
} from '../../optimizer/index';
import type { SavingsCurveSource } from '../../shared/schemas/savings';
import type { Actor, AppDeps } from '../context';
import { vesselModeHours } from '../db/schema';
import { listVesselCurves } from './curves';
import { loadStoredLogs, loadVesselLogContext, rawOf } from './logs-data';
import { deriveSetDays, resolveLot } from './logs-derive';
import { buildPlantModel } from './plant-model';
import { rulesOfVessel, ruleOf } from './recommendations';

export interface VesselSavingsData {
  vessel: Awaited<ReturnType<typeof buildPlantModel>>['vessel'];
  units: GensetUnit[];
  fits: Record<string, CurveUncertainty>;
  rules: Partial<Record<OperatingMode, ReserveRule>>;
  days: SavingsDay[];
  curves: SavingsCurveSource[];
  skippedDays: { date: string; reason: string }[];
  warnings: string[];
}

const MODE_COLUMNS: Record<OperatingMode, 'seaH' | 'manoeuvringH' | 'portH' | 'anchorageH'> = {
  sea: 'seaH',
  manoeuvring: 'manoeuvringH',
  port: 'portH',
  anchorage: 'anchorageH',
};

function finiteMatrix(m: unknown): m is number[][] {
  return Array.isArray(m) && m.length === 3 && m.every((row) => Array.isArray(row) && row.length === 3 && row.every((x) => typeof x === 'number' && Number.isFinite(x)));
}

/**
 * Loads the savings input of a vessel the actor may see (404 otherwise) for the days from..to (inclusive).
 * Historical availability of the sets is not recorded: every set that is in the plant counts as available on
 * every past day (a set that ran that day was available), and must-run orders of today do not apply to the past.
 */
export async function loadVesselSavingsData(deps: AppDeps, actor: Actor, vesselId: string, from: string, to: string): Promise<VesselSavingsData> {
  const plant = await buildPlantModel(deps, actor, vesselId);
  const warnings: string[] = [];
  for (const l of plant.model.leftOut) warnings.push(`${l.designation} left out: ${l.reason}`);
  const units: GensetUnit[] = plant.units.map((u) => ({ ...u, available: true, mustRun: false }));
  const curvesView = units.length ? await listVesselCurves(deps, actor, vesselId, { window: 'since_overhaul' }) : { sets: [] };
  const fitById = new Map(curvesView.sets.map((s) => [s.gensetId, s]));
  const fits: Record<string, CurveUncertainty> = {};
  const curves: SavingsCurveSource[] = [];
  for (const u of plant.model.units) {
    const stored = fitById.get(u.gensetId)?.fit;
    let hasCovariance = false;
    if (u.curveSource === 'fit' && stored && finiteMatrix(stored.covariance)) {
      fits[u.gensetId] = { curve: { kind: 'quadratic', ...u.curve }, covariance: stored.covariance, dof: stored.dof > 0 ? stored.dof : undefined };
      hasCovariance = true;
    }
    curves.push({ gensetId: u.gensetId, designation: u.designation, source: u.curveSource, note: u.curveNote, hasCovariance });
  }
  const storedRules = await rulesOfVessel(deps.db, vesselId);
  const rules: Partial<Record<OperatingMode, ReserveRule>> = {};
  for (const m of OPERATING_MODES) rules[m] = ruleOf(storedRules, m);

  const ctx = await loadVesselLogContext(deps.db, vesselId);
  const unitIds = new Set(units.map((u) => u.id));
  const sets = ctx.sets.filter((s) => unitIds.has(s.id));
  const dayBefore = dateOfDayNumber(dayNumber(from) - 1);
  const stored = await loadStoredLogs(deps.db, sets.map((s) => s.id), dayBefore, to);
  const modeRows = await deps.db
    .select()
    .from(vesselModeHours)
    .where(and(eq(vesselModeHours.vesselId, vesselId), gte(vesselModeHours.logDate, from), lte(vesselModeHours.logDate, to)));
  const modesByDate = new Map(modeRows.map((m) => [m.logDate, m]));

  interface SetDay {
    unitId: string;
    designation: string;
    hoursRun: number | null;
    kwh: number | null;
    measuredKg: number | null;
    lcvKjPerKg: number | null;
    grade: string | null;
    density15KgPerM3: number | null;
  }
  const byDate = new Map<string, SetDay[]>();
  for (const set of sets) {
    const mine = stored.filter((s) => s.gensetId === set.id);
    const { byDate: derived } = deriveSetDays(
      set,
      mine.map((s) => ({ logDate: s.logDate, values: rawOf(s) })),
      ctx.lotsById,
      ctx.lotsByDate,
      ctx.replacements.get(set.id) ?? new Map(),
      { dayLengthsH: ctx.dayLengthsH },
    );
    for (const s of mine) {
      if (s.logDate < from || s.logDate > to) continue;
      const d = derived.get(s.logDate)?.derived;
      const { lot } = resolveLot(rawOf(s), s.logDate, ctx.lotsById, ctx.lotsByDate);
      const list = byDate.get(s.logDate) ?? [];
      list.push({
        unitId: set.id,
        designation: set.designation,
        hoursRun: d?.hoursRun ?? null,
        kwh: d?.kwh ?? null,
        measuredKg: d?.fuelKgAt15 ?? null,
        lcvKjPerKg: d?.lcvKjPerKg ?? null,
        grade: lot?.grade ?? null,
        density15KgPerM3: lot?.density15KgPerM3 ?? null,
      });
      byDate.set(s.logDate, list);
    }
  }

  const days: SavingsDay[] = [];
  const skippedDays: { date: string; reason: string }[] = [];
  for (const date of [...byDate.keys()].sort()) {
    const list = byDate.get(date)!;
    const broken = list.filter((s) => s.hoursRun === null || s.kwh === null);
    if (broken.length) {
      skippedDays.push({ date, reason: `hours run or kWh cannot be derived for ${broken.map((s) => s.designation).join(', ')} (see the log table)` });
      continue;
    }
    const running = list.filter((s) => (s.hoursRun ?? 0) > 0);
    if (!running.length) continue;
    const mode = modesByDate.get(date);
    if (!mode) {
      skippedDays.push({ date, reason: 'no operating-mode hours logged for this day' });
      continue;
    }
    const modeHours: Partial<Record<OperatingMode, number>> = {};
    for (const m of OPERATING_MODES) if (mode[MODE_COLUMNS[m]] > 0) modeHours[m] = mode[MODE_COLUMNS[m]];
    if (!Object.keys(modeHours).length) {
      skippedDays.push({ date, reason: 'sets ran but no hours are logged in a mode with the gensets running (only shore power)' });
      continue;
    }
    const fuelSet = running.find((s) => s.grade !== null);
    const grade = fuelSet?.grade ?? null;
    if (!grade || !(FUEL_GRADES as readonly string[]).includes(grade)) {
      skippedDays.push({ date, reason: grade ? `fuel grade ${grade} has no MEPC.364(79) factor` : 'no fuel lot registered for this day' });
      continue;
    }
    days.push({
      date,
      modeHours,
      sets: running.map((s) => ({
        unitId: s.unitId,
        hoursRun: s.hoursRun as number,
        kwh: s.kwh as number,
        ...(s.measuredKg !== null ? { measuredFuelKg: s.measuredKg } : {}),
      })),
      fuel: {
        grade: grade as FuelGrade,
        ...(fuelSet?.lcvKjPerKg ? { lcvKjPerKg: fuelSet.lcvKjPerKg } : {}),
        ...(fuelSet?.density15KgPerM3 ? { lot: { density15KgPerM3: fuelSet.density15KgPerM3 } } : {}),
      },
    });
  }
  return { vessel: plant.vessel, units, fits, rules, days, curves, skippedDays, warnings };
}
