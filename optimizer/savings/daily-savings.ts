/**
 * One logged day of a vessel: the actual operation and the recommended operation for the same energy and mode
 * hours, both costed with the same fitted curves.
 */
import { dispatchLoad, equalSplit, rankCombinations, type Demand } from '../dispatch/index';
import { ISO_3046_REFERENCE_LCV_KJ_PER_KG } from '../fuel/index';
import { curveFuelKgPerH, minLoadKw, OPERATING_MODES, type GensetUnit, type OperatingMode } from '../plant';
import type {
  ActualSetResult,
  CurveUncertainty,
  DaySavings,
  FuelSensitivity,
  ModeRecommendation,
  SavingsDay,
  SavingsInput,
} from './types';

const DATE_PATTERN = /^\d{4}-\d{2}-\d{2}$/;
/** Sets whose running hours differ by no more than this ran "the same hours" for the actual-sets split saving. */
const DEFAULT_SAME_HOURS_TOLERANCE_H = 0.5;
const HOURS_TOLERANCE = 1e-9;

export interface DaySavingsOptions {
  /** Largest spread of the running sets' hours for the actual-sets split saving, h; default 0.5. */
  sameHoursToleranceH?: number;
}

function fail(caller: string, what: string): never {
  throw new Error(`${caller} requires ${what}`);
}

function isNonNegative(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x) && x >= 0;
}

/**
 * The vessel's units with each fitted curve in place of the unit's own, every curve checked to be quadratic.
 *
 * Cost: O(N). Throws on a non-quadratic curve, a fit for an unknown unit, or a covariance that is not 3 × 3.
 *
 * @example unitsWithFittedCurves(units, { DG1: fit }).find((u) => u.id === 'DG1').curve === fit.curve // true
 */
export function unitsWithFittedCurves(units: GensetUnit[], fits: Record<string, CurveUncertainty> = {}, caller = 'vesselSavings'): GensetUnit[] {
  const ids = new Set(units.map((u) => u.id));
  for (const [id, fit] of Object.entries(fits)) {
    if (!ids.has(id)) fail(caller, `a fit only for a known unit (got ${id})`);
    const cov = fit.covariance;
    if (!Array.isArray(cov) || cov.length !== 3 || cov.some((row) => !Array.isArray(row) || row.length !== 3 || !row.every(Number.isFinite))) {
      fail(caller, `a finite 3 × 3 covariance of (a, b, c) for unit ${id}`);
    }
    if (fit.dof !== undefined && !(fit.dof > 0)) fail(caller, `dof > 0 for unit ${id}`);
  }
  return units.map((u) => {
    const curve = fits[u.id]?.curve ?? u.curve;
    if (curve.kind !== 'quadratic' || ![curve.a, curve.b, curve.c].every(Number.isFinite)) {
      fail(caller, `quadratic fuel curves with finite coefficients (set ${u.name || u.id})`);
    }
    return { ...u, curve };
  });
}

function checkDay(day: SavingsDay, unitIds: Set<string>, caller: string): void {
  if (typeof day.date !== 'string' || !DATE_PATTERN.test(day.date) || Number.isNaN(Date.parse(day.date))) {
    fail(caller, `an ISO date YYYY-MM-DD (got ${String(day.date)})`);
  }
  for (const [mode, h] of Object.entries(day.modeHours ?? {})) {
    if (!(OPERATING_MODES as readonly string[]).includes(mode)) fail(caller, `known operating modes (got ${mode} on ${day.date})`);
    if (!isNonNegative(h)) fail(caller, `mode hours ≥ 0 (${mode} on ${day.date})`);
  }
  for (const [mode, kw] of Object.entries(day.modeLoadsKw ?? {})) {
    if (!isNonNegative(kw)) fail(caller, `mode loads ≥ 0 kW (${mode} on ${day.date})`);
  }
  const seen = new Set<string>();
  for (const s of day.sets) {
    if (!unitIds.has(s.unitId)) fail(caller, `sets of the vessel (unknown ${s.unitId} on ${day.date})`);
    if (seen.has(s.unitId)) fail(caller, `one entry per set and day (${s.unitId} twice on ${day.date})`);
    seen.add(s.unitId);
    if (!isNonNegative(s.hoursRun) || !isNonNegative(s.kwh)) fail(caller, `hoursRun ≥ 0 and kwh ≥ 0 (${s.unitId} on ${day.date})`);
    if (s.kwh > 0 && s.hoursRun <= 0) fail(caller, `hoursRun > 0 for a set with kWh (${s.unitId} on ${day.date})`);
    if (s.measuredFuelKg !== undefined && !isNonNegative(s.measuredFuelKg)) fail(caller, `measuredFuelKg ≥ 0 (${s.unitId} on ${day.date})`);
  }
  const lcv = day.fuel?.lcvKjPerKg;
  if (!day.fuel || (lcv !== undefined && !(lcv > 0 && Number.isFinite(lcv)))) fail(caller, `a day fuel with lcvKjPerKg > 0 (${day.date})`);
  for (const id of day.unavailableUnitIds ?? []) if (!unitIds.has(id)) fail(caller, `unavailable ids of the vessel's sets (got ${id})`);
}

function addSensitivity(target: FuelSensitivity, unitId: string, weightH: number, loadKw: number): void {
  const g = (target[unitId] ??= [0, 0, 0]);
  g[0] += weightH;
  g[1] += weightH * loadKw;
  g[2] += weightH * loadKw * loadKw;
}

/** a − b per unit (units of either). */
export function subtractSensitivity(a: FuelSensitivity, b: FuelSensitivity): FuelSensitivity {
  const out: FuelSensitivity = {};
  for (const id of new Set([...Object.keys(a), ...Object.keys(b)])) {
    const x = a[id] ?? [0, 0, 0];
    const y = b[id] ?? [0, 0, 0];
    out[id] = [x[0] - y[0], x[1] - y[1], x[2] - y[2]];
  }
  return out;
}

/** Plant load per mode: logged per-mode loads (or the day's average) scaled to the day's metered energy. */
function modeLoads(day: SavingsDay, energyKwh: number, plantHours: number): { mode: OperatingMode; hours: number; loadKw: number }[] {
  const active = OPERATING_MODES.filter((m) => (day.modeHours[m] ?? 0) > 0);
  const average = plantHours > 0 ? energyKwh / plantHours : 0;
  const shape = active.map((m) => day.modeLoadsKw?.[m] ?? average);
  const shapedKwh = active.reduce((s, m, i) => s + shape[i] * (day.modeHours[m] ?? 0), 0);
  const scale = shapedKwh > 0 ? energyKwh / shapedKwh : 0;
  return active.map((m, i) => ({ mode: m, hours: day.modeHours[m] ?? 0, loadKw: shape[i] * scale }));
}

/** Demand of a mode: the plant load, or with the bus tie open per section pro rata to the day's kWh by section. */
function modeDemand(units: GensetUnit[], day: SavingsDay, loadKw: number, busTieClosed: boolean, energyKwh: number): Demand {
  if (busTieClosed) return loadKw;
  const bySection: Record<string, number> = {};
  for (const u of units) bySection[u.busSection] = 0;
  const sectionOf = new Map(units.map((u) => [u.id, u.busSection]));
  for (const s of day.sets) {
    const section = sectionOf.get(s.unitId)!;
    bySection[section] += energyKwh > 0 ? (loadKw * s.kwh) / energyKwh : 0;
  }
  return bySection;
}

function recommendMode(
  units: GensetUnit[],
  day: SavingsDay,
  input: Pick<SavingsInput, 'rules'>,
  part: { mode: OperatingMode; hours: number; loadKw: number },
  energyKwh: number,
  massFactor: number,
  sensitivity: FuelSensitivity,
): ModeRecommendation {
  const rule = input.rules[part.mode];
  if (!rule) fail('vesselSavings', `a reserve rule for every mode with hours (no rule for ${part.mode} on ${day.date})`);
  const head = { mode: part.mode, hours: part.hours, loadKw: part.loadKw };
  const ranked = rankCombinations(units, modeDemand(units, day, part.loadKw, rule.busTieClosed, energyKwh), rule);
  if (!ranked.feasible) {
    return { ...head, feasible: false, unitIds: [], loadsKw: {}, fuelKg: null, equalSplitFuelKg: null, reasons: ranked.reasons };
  }
  const loadsKw: Record<string, number> = {};
  for (const u of ranked.best.units) {
    loadsKw[u.id] = u.loadKw;
    addSensitivity(sensitivity, u.id, part.hours * massFactor, u.loadKw);
  }
  const equal = ranked.equalSplitFuelKgPerH;
  return {
    ...head,
    feasible: true,
    unitIds: [...ranked.best.unitIds].sort(),
    loadsKw,
    fuelKg: ranked.best.fuelKgPerH * part.hours * massFactor,
    equalSplitFuelKg: equal === null ? null : equal * part.hours * massFactor,
    reasons: ranked.equalSplitReason ? [ranked.equalSplitReason] : [],
  };
}

/** Equal split − optimal split of the day's energy over the sets actually run, when they ran the same hours. */
function actualSetsSplitSaving(
  running: GensetUnit[],
  hours: number[],
  energyKwh: number,
  massFactor: number,
  toleranceH: number,
): { kg: number | null; reason: string | null } {
  if (running.length === 0) return { kg: 0, reason: null };
  const spreadH = Math.max(...hours) - Math.min(...hours);
  if (spreadH > toleranceH + HOURS_TOLERANCE) {
    return { kg: null, reason: `the sets ran different hours (spread ${spreadH.toFixed(2)} h); their hour-by-hour split is not known` };
  }
  const meanH = hours.reduce((s, h) => s + h, 0) / hours.length;
  const loadKw = energyKwh / meanH;
  const optimal = dispatchLoad(running, loadKw);
  const equal = equalSplit(running, loadKw);
  if (!optimal.feasible) return { kg: null, reason: optimal.reason };
  if (!equal.feasible) return { kg: null, reason: equal.reason };
  return { kg: (equal.fuelKgPerH - optimal.fuelKgPerH) * meanH * massFactor, reason: null };
}

/**
 * Savings of one logged day: the actual operation against the recommended one, both costed with the same curves.
 *
 * Method. Modelled actual fuel: each set at its daily average load P = kWh / h for its h hours, Σ h·F(P). The
 * recommendation: the day's energy is split across the modes with hours, at the logged per-mode load scaled by one
 * factor to the metered energy, or at the day's average load when per-mode loads are absent; each mode's load is
 * given to `rankCombinations` under that mode's reserve rule (bus tie open: per section, pro rata to the day's
 * kWh by section) and the best combination runs for the mode's hours. Avoidable fuel = modelled actual −
 * recommended; the model's bias cancels to first order because both use the same curves. Starts, minimum up and
 * down times and changes of combination between modes are not costed on either side. Fuel is ISO fuel × 42 700 /
 * LCV of the day's lot (ISO 3046-1 reference LCV). Reference for the commitment and dispatch: Wood & Wollenberg,
 * Power Generation, Operation and Control, 2nd ed., §3.1 and §5.2.
 *
 * Cost: one `rankCombinations` per mode with hours (O(2^N) dispatches each) plus O(N).
 *
 * Throws on bad input (unknown set or mode, negative hours or kWh, kWh without hours, a mode with hours but no
 * rule, energy without mode hours, a non-quadratic curve). An infeasible recommendation is a result:
 * `recommendationFeasible: false` with each mode's reasons and `avoidableFuelKg: null`.
 *
 * @example
 * const d = daySavings({ units, rules: { sea: rule } }, { date: '2024-03-01', modeHours: { sea: 24 },
 *   sets: [{ unitId: 'DG1', hoursRun: 24, kwh: 12000 }, { unitId: 'DG2', hoursRun: 24, kwh: 12000 }], fuel: { grade: 'MGO' } });
 * d.avoidableFuelKg; // modelled fuel of running both sets − fuel of the recommended operation
 */
export function daySavings(input: Omit<SavingsInput, 'days'>, day: SavingsDay, options: DaySavingsOptions = {}): DaySavings {
  const caller = 'vesselSavings';
  const units = unitsWithFittedCurves(input.units, input.fits, caller);
  return costDay(units, input, day, options);
}

/** daySavings on units whose curves are already in place (used per curve draw by the sampling). */
export function costDay(units: GensetUnit[], input: Pick<SavingsInput, 'rules'>, day: SavingsDay, options: DaySavingsOptions = {}): DaySavings {
  const caller = 'vesselSavings';
  const byId = new Map(units.map((u) => [u.id, u]));
  checkDay(day, new Set(byId.keys()), caller);
  const toleranceH = options.sameHoursToleranceH ?? DEFAULT_SAME_HOURS_TOLERANCE_H;
  if (!isNonNegative(toleranceH)) fail(caller, 'sameHoursToleranceH ≥ 0');
  const massFactor = ISO_3046_REFERENCE_LCV_KJ_PER_KG / (day.fuel.lcvKjPerKg ?? ISO_3046_REFERENCE_LCV_KJ_PER_KG);

  const modelledActualSensitivity: FuelSensitivity = {};
  let energyKwh = 0;
  let modelledActualFuelKg = 0;
  let measured: number | null = 0;
  let lowLoadHours = 0;
  const actualSets: ActualSetResult[] = day.sets.map((s) => {
    const unit = byId.get(s.unitId)!;
    const loadKw = s.hoursRun > 0 ? s.kwh / s.hoursRun : 0;
    const modelledFuelKg = s.hoursRun > 0 ? curveFuelKgPerH(unit.curve, loadKw) * s.hoursRun * massFactor : 0;
    if (s.hoursRun > 0) addSensitivity(modelledActualSensitivity, s.unitId, s.hoursRun * massFactor, loadKw);
    const low = s.hoursRun > 0 && loadKw < minLoadKw(unit) * (1 - 1e-9) ? s.hoursRun : 0;
    energyKwh += s.kwh;
    modelledActualFuelKg += modelledFuelKg;
    lowLoadHours += low;
    if (s.hoursRun > 0 || (s.measuredFuelKg ?? 0) > 0) measured = s.measuredFuelKg === undefined || measured === null ? null : measured + s.measuredFuelKg;
    return {
      unitId: s.unitId,
      hoursRun: s.hoursRun,
      kwh: s.kwh,
      loadKw,
      loadPct: (100 * loadKw) / unit.ratedKw,
      modelledFuelKg,
      measuredFuelKg: s.measuredFuelKg ?? null,
      lowLoadHours: low,
    };
  });
  const plantHours = OPERATING_MODES.reduce((s, m) => s + (day.modeHours[m] ?? 0), 0);
  if (energyKwh > 0 && plantHours <= 0) fail(caller, `mode hours on a day with energy (${day.date})`);

  const unavailable = new Set(day.unavailableUnitIds ?? []);
  const dayUnits = units.map((u) => (unavailable.has(u.id) ? { ...u, available: false } : u));
  const recommendedSensitivity: FuelSensitivity = {};
  const modes = modeLoads(day, energyKwh, plantHours).map((part) =>
    recommendMode(dayUnits, day, input, part, energyKwh, massFactor, recommendedSensitivity),
  );
  const recommendationFeasible = modes.every((m) => m.feasible);
  const recommendedFuelKg = recommendationFeasible ? modes.reduce((s, m) => s + (m.fuelKg ?? 0), 0) : null;
  const avoidableFuelKg = recommendedFuelKg === null ? null : modelledActualFuelKg - recommendedFuelKg;
  const splitRecommended = recommendationFeasible && modes.every((m) => m.equalSplitFuelKg !== null)
    ? modes.reduce((s, m) => s + (m.equalSplitFuelKg! - m.fuelKg!), 0)
    : null;

  const runningSets = day.sets.filter((s) => s.hoursRun > 0);
  const actualUnitIds = runningSets.map((s) => s.unitId).sort();
  const split = actualSetsSplitSaving(
    runningSets.map((s) => byId.get(s.unitId)!),
    runningSets.map((s) => s.hoursRun),
    energyKwh,
    massFactor,
    toleranceH,
  );
  const loadedModes = modes.filter((m) => m.loadKw > 0);
  const followedRecommendation =
    recommendationFeasible && loadedModes.length > 0 && loadedModes.every((m) => m.unitIds.join('\u0000') === actualUnitIds.join('\u0000'));
  const residualKg = measured === null ? null : measured - modelledActualFuelKg;

  return {
    date: day.date,
    month: day.date.slice(0, 7),
    energyKwh,
    plantHours,
    averageLoadKw: plantHours > 0 ? energyKwh / plantHours : 0,
    isoToMassFactor: massFactor,
    fuel: day.fuel,
    actualSets,
    actualUnitIds,
    modelledActualFuelKg,
    measuredFuelKg: measured,
    residualKg,
    residualPct: residualKg === null || modelledActualFuelKg <= 0 ? null : (100 * residualKg) / modelledActualFuelKg,
    modes,
    recommendationFeasible,
    recommendedFuelKg,
    avoidableFuelKg,
    avoidablePct: avoidableFuelKg === null || modelledActualFuelKg <= 0 ? null : (100 * avoidableFuelKg) / modelledActualFuelKg,
    splitSavingRecommendedSetsKg: splitRecommended,
    splitSavingActualSetsKg: split.kg,
    splitSavingActualSetsReason: split.reason,
    lowLoadHours,
    followedRecommendation,
    avoidableSensitivity: avoidableFuelKg === null ? null : subtractSensitivity(modelledActualSensitivity, recommendedSensitivity),
    modelledActualSensitivity,
  };
}
