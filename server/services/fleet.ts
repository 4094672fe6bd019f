/**
 * Fleet benchmarking: per vessel and per service set over a chosen period, plant SFOC (ISO), SFOC at 75 % from the
 * curve, load factor, low-load share, avoidable fuel (savings service), drift alerts, running-hour balance and
 * hours to the next overhaul; sister-set curves and a monthly trend. Vessels are those the actor may see.
 */
import { asc, eq, inArray, max } from 'drizzle-orm';
import { sampleStandardDeviation, mean } from 'simple-statistics';
import { curveFuelKgPerH } from '../../optimizer/index';
import { FLEET_METHOD, type FleetBenchmark, type FleetMonthRow, type FleetSetRow, type FleetVesselRow, type SisterCurveGroup } from '../../shared/schemas/fleet';
import { SAVINGS_CAUTION, savingsQuerySchema, type SavingsQuery, type VesselSavingsReport } from '../../shared/schemas/savings';
import type { Actor, AppDeps } from '../context';
import { gensetDailyLogs, gensetMaintenance, maintenanceEvents, vessels } from '../db/schema';
import { AppError } from '../errors';
import { parseBody } from '../lib/parse';
import { inScope, vesselForActor } from './access';
import { listVesselCurves } from './curves';
import { loadCurveInputs } from './curve-inputs';
import { buildPlantModel } from './plant-model';
import { computeVesselSavings } from './savings';

const CURVE_POINTS_PCT = [25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75, 80, 85, 90, 95, 100];

interface Maintenance {
  hoursSinceOverhaulH: number | null;
  hoursToNextOverhaulH: number | null;
  nextOverhaulKind: string | null;
}

/** Running hours since the last overhaul and to the next due of each set, from the meter and the maintenance table. */
async function maintenanceOf(deps: AppDeps, gensetIds: string[]): Promise<Map<string, Maintenance>> {
  const out = new Map<string, Maintenance>();
  if (!gensetIds.length) return out;
  const [meters, kinds, events] = await Promise.all([
    deps.db
      .select({ gensetId: gensetDailyLogs.gensetId, hours: max(gensetDailyLogs.runningHoursMeter) })
      .from(gensetDailyLogs)
      .where(inArray(gensetDailyLogs.gensetId, gensetIds))
      .groupBy(gensetDailyLogs.gensetId),
    deps.db.select().from(gensetMaintenance).where(inArray(gensetMaintenance.gensetId, gensetIds)),
    deps.db.select().from(maintenanceEvents).where(inArray(maintenanceEvents.gensetId, gensetIds)).orderBy(asc(maintenanceEvents.doneOn)),
  ]);
  const meterOf = new Map(meters.map((m) => [m.gensetId, m.hours === null ? null : Number(m.hours)]));
  for (const id of gensetIds) {
    const current = meterOf.get(id) ?? null;
    let since: number | null = null;
    let toNext: number | null = null;
    let kind: string | null = null;
    for (const k of kinds.filter((x) => x.gensetId === id)) {
      const done = events.filter((e) => e.gensetId === id && e.kind.trim().toLowerCase() === k.kind.trim().toLowerCase()).map((e) => e.runningHours);
      const lastDone = Math.max(k.lastDoneRunningHours ?? -Infinity, ...done);
      if (!Number.isFinite(lastDone) || current === null) continue;
      const left = lastDone + k.intervalHours - current;
      if (toNext === null || left < toNext) {
        toNext = left;
        kind = k.kind;
      }
      if (/overhaul/i.test(k.kind)) since = since === null ? current - lastDone : Math.min(since, current - lastDone);
    }
    out.set(id, { hoursSinceOverhaulH: since, hoursToNextOverhaulH: toNext, nextOverhaulKind: kind });
  }
  return out;
}

interface SetAccumulator {
  hours: number;
  kwh: number;
  lowHours: number;
  fuelIsoKg: number;
  fuelKwh: number;
}

const emptyAcc = (): SetAccumulator => ({ hours: 0, kwh: 0, lowHours: 0, fuelIsoKg: 0, fuelKwh: 0 });
const sfocOf = (a: SetAccumulator) => (a.fuelKwh > 0 ? (1000 * a.fuelIsoKg) / a.fuelKwh : null);

interface VesselBenchmark {
  vessel: FleetVesselRow;
  sets: FleetSetRow[];
  monthly: FleetMonthRow[];
  curves: { ratedKw: number; entry: SisterCurveGroup['sets'][number] }[];
  savings: VesselSavingsReport | null;
}

/** The benchmark rows of one vessel the actor may see. */
export async function benchmarkVessel(deps: AppDeps, actor: Actor, vesselId: string, q: { from: string; to: string; level: number }): Promise<VesselBenchmark> {
  const plant = await buildPlantModel(deps, actor, vesselId);
  const vesselName = plant.vessel.name;
  const ids = plant.model.units.map((u) => u.gensetId);
  const [inputs, curves, maint] = await Promise.all([
    loadCurveInputs(deps.db, vesselId),
    ids.length ? listVesselCurves(deps, actor, vesselId, { window: 'since_overhaul' }) : Promise.resolve({ sets: [] as { gensetId: string; drift: { alert: boolean; excessGPerKwh: number | null } | null }[] }),
    maintenanceOf(deps, ids),
  ]);
  const driftOf = new Map(curves.sets.map((s) => [s.gensetId, s.drift]));
  const plantAcc = emptyAcc();
  const monthAcc = new Map<string, SetAccumulator>();
  const sets: FleetSetRow[] = [];
  const curveEntries: VesselBenchmark['curves'] = [];
  for (const u of plant.model.units) {
    const input = inputs.find((s) => s.id === u.gensetId);
    const acc = emptyAcc();
    for (const d of input?.days ?? []) {
      if (d.date < q.from || d.date > q.to || !d.hoursRun || d.avgLoadKw === null) continue;
      const kwh = d.avgLoadKw * d.hoursRun;
      const month = d.date.slice(0, 7);
      const m = monthAcc.get(month) ?? emptyAcc();
      for (const a of [acc, plantAcc, m]) {
        a.hours += d.hoursRun;
        a.kwh += kwh;
        if ((100 * d.avgLoadKw) / u.ratedKw < u.minLoadPct) a.lowHours += d.hoursRun;
        if (d.fuelKgIso !== null && d.usable) {
          a.fuelIsoKg += d.fuelKgIso;
          a.fuelKwh += kwh;
        }
      }
      monthAcc.set(month, m);
    }
    const curve = { kind: 'quadratic' as const, ...u.curve };
    const p75 = 0.75 * u.ratedKw;
    const drift = driftOf.get(u.gensetId) ?? null;
    const mt = maint.get(u.gensetId);
    sets.push({
      vesselId,
      vesselName,
      gensetId: u.gensetId,
      designation: u.designation,
      ratedKw: u.ratedKw,
      curveSource: u.curveSource,
      hoursRun: acc.hours,
      energyMwh: acc.kwh / 1000,
      sfocIsoGPerKwh: sfocOf(acc),
      sfoc75GPerKwh: (1000 * curveFuelKgPerH(curve, p75)) / p75,
      avgLoadFactorPct: acc.hours > 0 ? (100 * acc.kwh) / (acc.hours * u.ratedKw) : null,
      lowLoadHoursSharePct: acc.hours > 0 ? (100 * acc.lowHours) / acc.hours : null,
      driftAlert: drift?.alert ?? false,
      driftExcessGPerKwh: drift?.excessGPerKwh ?? null,
      hoursSinceOverhaulH: mt?.hoursSinceOverhaulH ?? null,
      hoursToNextOverhaulH: mt?.hoursToNextOverhaulH ?? null,
      nextOverhaulKind: mt?.nextOverhaulKind ?? null,
    });
    curveEntries.push({
      ratedKw: u.ratedKw,
      entry: {
        vesselName,
        designation: u.designation,
        curveSource: u.curveSource,
        points: CURVE_POINTS_PCT.map((pct) => {
          const p = (pct * u.ratedKw) / 100;
          return { loadPct: pct, sfocGPerKwh: (1000 * curveFuelKgPerH(curve, p)) / p };
        }),
      },
    });
  }
  let savings: VesselSavingsReport | null = null;
  let savingsUnavailable: string | null = null;
  try {
    savings = await computeVesselSavings(deps, actor, vesselId, q);
    if (savings.period.days === 0) savingsUnavailable = 'No costed days in the period';
  } catch (e) {
    if (!(e instanceof AppError) || e.code !== 'validation_failed') throw e;
    savingsUnavailable = e.message;
  }
  const sinceOverhaul = sets.map((s) => s.hoursSinceOverhaulH);
  const known = sinceOverhaul.filter((h): h is number => h !== null);
  const periodHours = sets.map((s) => s.hoursRun);
  const toOverhaul = sets.map((s) => s.hoursToNextOverhaulH).filter((h): h is number => h !== null);
  const period = savings && savings.period.days > 0 ? savings.period : null;
  const vessel: FleetVesselRow = {
    vesselId,
    vesselName,
    setCount: sets.length,
    energyMwh: plantAcc.kwh / 1000,
    plantSfocIsoGPerKwh: sfocOf(plantAcc),
    avgLoadFactorPct: plantAcc.hours > 0 ? (100 * plantAcc.kwh) / sets.reduce((s, x) => s + x.hoursRun * x.ratedKw, 0) : null,
    lowLoadHoursSharePct: plantAcc.hours > 0 ? (100 * plantAcc.lowHours) / plantAcc.hours : null,
    avoidableFuelT: period ? period.avoidableFuelT : null,
    avoidablePct: period ? period.avoidablePct : null,
    avoidableCo2T: period ? period.co2.avoidableT : null,
    driftAlerts: sets.filter((s) => s.driftAlert).length,
    hoursSinceOverhaulSpreadH: known.length >= 2 && known.length === sinceOverhaul.length ? Math.max(...known) - Math.min(...known) : null,
    periodHoursCvPct: periodHours.length >= 2 && mean(periodHours) > 0 ? (100 * sampleStandardDeviation(periodHours)) / mean(periodHours) : null,
    minHoursToOverhaulH: toOverhaul.length ? Math.min(...toOverhaul) : null,
    savingsUnavailable,
  };
  const savedByMonth = new Map((savings?.byMonth ?? []).map((m) => [m.label, m]));
  const monthly: FleetMonthRow[] = [...monthAcc.entries()]
    .sort(([a], [b]) => (a < b ? -1 : 1))
    .map(([month, a]) => ({
      vesselId,
      vesselName,
      month,
      plantSfocIsoGPerKwh: sfocOf(a),
      avoidableFuelT: savedByMonth.get(month)?.avoidableFuelT.value ?? null,
      avoidablePct: savedByMonth.get(month)?.avoidablePct ?? null,
    }));
  return { vessel, sets, monthly, curves: curveEntries, savings };
}

/** Vessels of the actor's company in the actor's scope, by name. */
export async function visibleVessels(deps: AppDeps, actor: Actor): Promise<{ id: string; name: string }[]> {
  const rows = await deps.db.select({ id: vessels.id, name: vessels.name }).from(vessels).where(eq(vessels.companyId, actor.companyId)).orderBy(asc(vessels.name));
  return rows.filter((v) => inScope(actor, v.id));
}

/** The fleet benchmark over a parsed period; also used by the fleet report. */
export async function computeFleetBenchmark(deps: AppDeps, actor: Actor, q: { from: string; to: string; level: number }): Promise<FleetBenchmark & { savings: (VesselSavingsReport | null)[] }> {
  const list = await visibleVessels(deps, actor);
  const parts: VesselBenchmark[] = [];
  for (const v of list) parts.push(await benchmarkVessel(deps, actor, v.id, q));
  const groups = new Map<number, SisterCurveGroup>();
  for (const p of parts) {
    for (const c of p.curves) {
      const g = groups.get(c.ratedKw) ?? { ratedKw: c.ratedKw, sets: [] };
      g.sets.push(c.entry);
      groups.set(c.ratedKw, g);
    }
  }
  return {
    from: q.from,
    to: q.to,
    currency: actor.currency,
    vessels: parts.map((p) => p.vessel),
    sets: parts.flatMap((p) => p.sets),
    sisterCurves: [...groups.values()].sort((a, b) => a.ratedKw - b.ratedKw),
    monthly: parts.flatMap((p) => p.monthly),
    method: FLEET_METHOD,
    caution: SAVINGS_CAUTION,
    savings: parts.map((p) => p.savings),
  };
}

/** The fleet benchmark of the vessels the actor may see. */
export async function getFleetBenchmark(deps: AppDeps, actor: Actor, rawQuery: SavingsQuery | unknown): Promise<FleetBenchmark> {
  const q = parseBody(savingsQuerySchema, rawQuery, 'benchmark period');
  const { savings: _savings, ...rest } = await computeFleetBenchmark(deps, actor, q);
  return rest;
}

/** The benchmark rows of one vessel (404 outside the actor's scope). */
export async function getVesselBenchmark(deps: AppDeps, actor: Actor, vesselId: string, rawQuery: unknown) {
  const q = parseBody(savingsQuerySchema, rawQuery, 'benchmark period');
  await vesselForActor(deps.db, actor, vesselId);
  const { savings: _s, curves: _c, ...rest } = await benchmarkVessel(deps, actor, vesselId, q);
  return rest;
}
