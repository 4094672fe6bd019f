/**
 * From a set's curve inputs to a fit: the window's dates, the days that enter (and why others are left out), the
 * canonical inputs and their hash, and the stored result (optimizer/fit fitFuelCurve, sfocBandAt, fitDrift).
 * No database access here; server/services/curves.ts stores and reads the fits.
 */
import { createHash } from 'node:crypto';
import { median } from 'simple-statistics';
import {
  dateOfDayNumber,
  dayNumber,
  fitDrift,
  fitFuelCurve,
  sfocBandAt,
  type DailyFuelPoint,
  type FuelCurveFit,
  type ShopTestPoint,
} from '../../optimizer/index';
import type { CurveFitStats, CurvePoint, CurveWindow, CurveWindowKind, DriftView } from '../../shared/schemas/curves';
import type { CurveInputSet } from './curve-inputs';

/** Version of the fitting recipe below; part of the hash, so a change of method refits every stored curve. */
export const CURVE_METHOD_VERSION = 1;
/** Options of every fit: Huber IRLS (k = 1.345), a ≥ 0 and c ≥ 0, hours-weighted, shop-test prior when data are thin. */
const FIT_OPTIONS = { robust: 'huber', constrained: true, weighting: 'hours', level: 0.95 } as const;
/** Drift alert: latest 500 running hours above the first 500 h after overhaul by more than 2 %, 95 % one-sided. */
const DRIFT_OPTIONS = { windowHours: 500, threshold: { pct: 2 }, confidence: 0.95, level: 0.95 } as const;
const SAMPLE_FROM_PCT = 10;
const SAMPLE_STEP_PCT = 2.5;

const ROLLING_DAYS: Partial<Record<CurveWindowKind, number>> = { rolling_90: 90, rolling_180: 180, rolling_365: 365 };

const addDays = (date: string, n: number) => dateOfDayNumber(dayNumber(date) + n);
const fin = (v: number | undefined | null): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/**
 * The dates a window covers for one set. Since overhaul: from the day after the last overhaul of a resetting kind
 * (the overhaul day itself mixes running before and after) to the set's last log; without a recorded overhaul,
 * all logs. Rolling N days: the N days ending on the set's last log. Custom: the dates given.
 */
export function resolveWindow(set: CurveInputSet, query: { window: CurveWindowKind; from?: string; to?: string }): CurveWindow {
  const last = set.days.length ? set.days[set.days.length - 1].date : null;
  const first = set.days.length ? set.days[0].date : null;
  if (query.window === 'custom') return { kind: 'custom', from: query.from ?? null, to: query.to ?? null, overhaul: null };
  const rolling = ROLLING_DAYS[query.window];
  if (rolling) return { kind: query.window, from: last ? addDays(last, -(rolling - 1)) : null, to: last, overhaul: null };
  const overhaul = set.overhauls.length ? set.overhauls[set.overhauls.length - 1] : null;
  return {
    kind: 'since_overhaul',
    from: overhaul ? addDays(overhaul.doneOn, 1) : first,
    to: last && overhaul && last < overhaul.doneOn ? overhaul.doneOn : last,
    overhaul: overhaul ? { kind: overhaul.kind, doneOn: overhaul.doneOn, runningHours: overhaul.runningHours } : null,
  };
}

/** The maker's shop test of the register as fit points (null entries dropped). */
export function shopTestPoints(set: CurveInputSet): ShopTestPoint[] {
  const s = set.shopTestSfoc;
  const pairs: [number, number | null][] = [
    [25, s.p25],
    [50, s.p50],
    [75, s.p75],
    [85, s.p85],
    [100, s.p100],
  ];
  return pairs.filter((p): p is [number, number] => p[1] !== null).map(([loadPct, sfocGPerKwh]) => ({ loadPct, sfocGPerKwh }));
}

export interface SelectedPoints {
  points: Omit<CurvePoint, 'robustWeight'>[];
  daysLogged: number;
  daysLeftOut: { excluded: number; flagged: number; shorePower: number; notRun: number };
}

/**
 * The days of a window that enter the fit: not excluded by the chief engineer, derived without an error flag and
 * with fuel logged, not a shore-power-only day, and run with load. Each point is (average load kW, ISO fuel rate
 * kg/h, hours run) with its log id; hours since overhaul count the hours run of every logged day after the
 * overhaul (a meter replacement does not disturb it).
 */
export function selectPoints(set: CurveInputSet, window: CurveWindow): SelectedPoints {
  const out: SelectedPoints = { points: [], daysLogged: 0, daysLeftOut: { excluded: 0, flagged: 0, shorePower: 0, notRun: 0 } };
  let hoursSince = 0;
  for (const d of set.days) {
    if (window.overhaul && d.date > window.overhaul.doneOn) hoursSince += d.hoursRun !== null && d.hoursRun > 0 ? d.hoursRun : 0;
    if ((window.from && d.date < window.from) || (window.to && d.date > window.to)) continue;
    out.daysLogged++;
    if (d.excluded) out.daysLeftOut.excluded++;
    else if (d.shorePowerOnly) out.daysLeftOut.shorePower++;
    else if (d.hoursRun === null || !(d.hoursRun > 0) || d.avgLoadKw === null || !(d.avgLoadKw > 0)) out.daysLeftOut.notRun++;
    else if (!d.usable || d.fuelKgIso === null || !(d.fuelKgIso > 0)) out.daysLeftOut.flagged++;
    else {
      const fuelKgPerH = d.fuelKgIso / d.hoursRun;
      out.points.push({
        logId: d.logId,
        date: d.date,
        loadKw: d.avgLoadKw,
        fuelKgPerH,
        hoursRun: d.hoursRun,
        sfocGPerKwh: (1000 * fuelKgPerH) / d.avgLoadKw,
        hoursSinceOverhaul: window.overhaul ? hoursSince : null,
      });
    }
  }
  return out;
}

/** Everything a fit depends on, in a fixed key order, so equal inputs give equal hashes. */
export interface CurveFitInputs {
  methodVersion: number;
  gensetId: string;
  ratedKw: number;
  window: CurveWindow;
  shopTest: ShopTestPoint[];
  points: Omit<CurvePoint, 'robustWeight'>[];
  daysLogged: number;
  daysLeftOut: SelectedPoints['daysLeftOut'];
}

export function buildInputs(set: CurveInputSet, window: CurveWindow): CurveFitInputs {
  const sel = selectPoints(set, window);
  return {
    methodVersion: CURVE_METHOD_VERSION,
    gensetId: set.id,
    ratedKw: set.ratedKw,
    window,
    shopTest: shopTestPoints(set),
    points: sel.points,
    daysLogged: sel.daysLogged,
    daysLeftOut: sel.daysLeftOut,
  };
}

/** SHA-256 of the canonical JSON of the inputs. */
export function hashInputs(inputs: CurveFitInputs): string {
  return createHash('sha256').update(JSON.stringify(inputs)).digest('hex');
}

/** What is stored in curve_fits.result. */
export interface StoredCurveResult {
  fit: CurveFitStats | null;
  drift: DriftView | null;
  /** Robust weight of each input point, in input order. */
  robustWeights: number[];
  reason: string | null;
}

function toDailyPoints(inputs: CurveFitInputs): DailyFuelPoint[] {
  return inputs.points.map((p) => ({
    loadKw: p.loadKw,
    fuelKgPerH: p.fuelKgPerH,
    hoursRun: p.hoursRun,
    date: p.date,
    id: p.logId,
    ...(p.hoursSinceOverhaul !== null ? { hoursSinceOverhaul: p.hoursSinceOverhaul } : {}),
  }));
}

function statsOf(fit: FuelCurveFit, ratedKw: number): CurveFitStats {
  const samples = [];
  for (let pct = SAMPLE_FROM_PCT; pct <= 100 + 1e-9; pct += SAMPLE_STEP_PCT) {
    const b = sfocBandAt(fit, (pct * ratedKw) / 100, FIT_OPTIONS.level);
    samples.push({ loadKw: b.loadKw, sfocGPerKwh: b.sfocGPerKwh, lowerGPerKwh: fin(b.lowerGPerKwh), upperGPerKwh: fin(b.upperGPerKwh), extrapolated: b.extrapolated });
  }
  return {
    coefficients: fit.coefficients,
    standardErrors: { a: fin(fit.standardErrors.a), b: fin(fit.standardErrors.b), c: fin(fit.standardErrors.c) },
    covariance: fit.covariance.map((row) => row.map(fin)),
    activeConstraints: fit.activeConstraints,
    rSquared: fin(fit.rSquared),
    residualSdKgPerH: fin(fit.residualSdKgPerH),
    dof: fit.dof,
    days: fit.days,
    loadRangeKw: fit.loadRangeKw,
    loadSpanPct: fit.loadSpanPct,
    robust: fit.robust,
    robustTuning: fit.robustTuning,
    iterations: fit.iterations,
    converged: fit.converged,
    priorUsed: fit.priorUsed,
    priorWeightDays: fit.priorWeightDays,
    priorWeightShare: fit.priorWeightShare,
    lowestSfoc: fit.lowestSfoc,
    atLoads: fit.atLoads.map((l) => ({
      loadPct: l.loadPct,
      loadKw: l.loadKw,
      sfocGPerKwh: l.sfocGPerKwh,
      lowerGPerKwh: fin(l.lowerGPerKwh),
      upperGPerKwh: fin(l.upperGPerKwh),
      extrapolated: l.extrapolated,
      shopSfocGPerKwh: l.shopSfocGPerKwh,
      offsetFromShopGPerKwh: l.offsetFromShopGPerKwh,
    })),
    outliers: fit.outliers.map((o) => ({
      logId: o.id ?? null,
      date: o.date ?? null,
      loadKw: o.loadKw,
      fuelKgPerH: o.fuelKgPerH,
      residualKgPerH: o.residualKgPerH,
      standardizedResidual: o.standardizedResidual,
      robustWeight: o.robustWeight,
    })),
    warnings: fit.warnings,
    samples,
  };
}

function noDrift(referenceLoadKw: number, referenceBasis: DriftView['referenceBasis'], why: string): DriftView {
  return {
    referenceLoadKw,
    referenceBasis,
    days: 0,
    slopeGPerKwhPer1000h: null,
    slopeInterval: { lower: null, upper: null, level: DRIFT_OPTIONS.level },
    interceptGPerKwh: null,
    daySfoc: [],
    baselineSfocGPerKwh: null,
    latestSfocGPerKwh: null,
    excessGPerKwh: null,
    excessLowerBoundGPerKwh: null,
    thresholdGPerKwh: null,
    confidence: DRIFT_OPTIONS.confidence,
    alert: false,
    alertUnavailable: why,
  };
}

/**
 * SFOC drift of a since-overhaul window: reference load = the set's median daily load (its usual load), or 75 % of
 * rating with fewer than 3 days; fitDrift with the window's fitted shape.
 */
function driftOf(inputs: CurveFitInputs, points: DailyFuelPoint[], fit: FuelCurveFit): DriftView {
  const loads = points.map((p) => p.loadKw);
  const basis: DriftView['referenceBasis'] = loads.length >= 3 ? 'median' : 'rated75';
  const referenceLoadKw = basis === 'median' ? median(loads) : 0.75 * inputs.ratedKw;
  if (!inputs.window.overhaul) return noDrift(referenceLoadKw, basis, 'No overhaul is recorded for this set, so running hours since overhaul are unknown.');
  try {
    const d = fitDrift(points, { ratedKw: inputs.ratedKw, referenceLoadKw, shape: fit, ...DRIFT_OPTIONS });
    return {
      referenceLoadKw,
      referenceBasis: basis,
      days: d.days,
      slopeGPerKwhPer1000h: fin(d.slopeGPerKwhPer1000h),
      slopeInterval: { lower: fin(d.slopeInterval.lower), upper: fin(d.slopeInterval.upper), level: d.slopeInterval.level },
      interceptGPerKwh: fin(d.interceptGPerKwh),
      daySfoc: d.daySfoc.map((r) => ({ date: points[r.index]?.date ?? null, hoursSinceOverhaul: r.hoursSinceOverhaul, sfocGPerKwh: r.sfocGPerKwh })),
      baselineSfocGPerKwh: fin(d.baseline?.sfocGPerKwh),
      latestSfocGPerKwh: fin(d.latest?.sfocGPerKwh),
      excessGPerKwh: fin(d.excessGPerKwh),
      excessLowerBoundGPerKwh: fin(d.excessLowerBoundGPerKwh),
      thresholdGPerKwh: fin(d.thresholdGPerKwh),
      confidence: d.confidence,
      alert: d.alert,
      alertUnavailable: d.alertUnavailable,
    };
  } catch (e) {
    return noDrift(referenceLoadKw, basis, (e as Error).message);
  }
}

/**
 * Fits the inputs. Fewer than 3 days with load, or too few distinct loads, is a result with a reason, not an error.
 * Drift is computed for since-overhaul windows only.
 */
export function computeCurve(inputs: CurveFitInputs): StoredCurveResult {
  const points = toDailyPoints(inputs);
  if (points.length < 3) {
    return {
      fit: null,
      drift: null,
      robustWeights: points.map(() => 1),
      reason:
        inputs.daysLogged === 0
          ? 'No logs in this window. Import the engine-room logs of this set, or choose a longer window.'
          : `Only ${points.length} usable ${points.length === 1 ? 'day' : 'days'} in this window (at least 3 are needed). Choose a longer window or review the left-out days.`,
    };
  }
  let fit: FuelCurveFit;
  try {
    fit = fitFuelCurve(points, { ratedKw: inputs.ratedKw, shopTest: inputs.shopTest, ...FIT_OPTIONS });
  } catch (e) {
    return { fit: null, drift: null, robustWeights: points.map(() => 1), reason: (e as Error).message };
  }
  return {
    fit: statsOf(fit, inputs.ratedKw),
    drift: inputs.window.kind === 'since_overhaul' ? driftOf(inputs, points, fit) : null,
    robustWeights: fit.robustWeights,
    reason: null,
  };
}

