/**
 * SFOC drift of one genset with running hours since overhaul.
 *
 * Each day's SFOC is moved to a reference load along the fitted curve's shape (an additive shift:
 * SFOCᵢ − SFOC_curve(Pᵢ) + SFOC_curve(P_ref)), then regressed on hours since overhaul (slope per 1000 h with a
 * Student t interval), and summarised in successive windows of running hours. The latest window is compared
 * with the post-overhaul baseline by a one-sided Welch interval (Welch, Biometrika 34, 1947).
 */
import { fitFuelCurve, sfocAt, type DailyFuelPoint, type FitFuelCurveOptions, type FuelCurveFit } from './fuel-curve-fit';
import type { RobustMethod } from './robust';
import { robustPolynomialLeastSquares } from './robust-fit';
import { studentTQuantile } from './student-t';

export interface FitDriftOptions {
  ratedKw: number;
  /** Reference load; default 75 % of rating. */
  referenceLoadKw?: number;
  /** Curve whose shape moves each day to the reference load; default: fitFuelCurve on the current cycle. */
  shape?: Pick<FuelCurveFit, 'curve'>;
  /** Options for that internal fit (ratedKw is taken from here). */
  fitOptions?: Omit<FitFuelCurveOptions, 'ratedKw'>;
  /** 'per-point' (default): slope from every day; 'windows': slope from the window means. */
  method?: 'per-point' | 'windows';
  /** Width of the running-hours windows; default 500 h. */
  windowHours?: number;
  /** Days with fewer hours since overhaul than this form the baseline; default windowHours. */
  baselineHours?: number;
  /** Alert threshold above baseline: the larger of gPerKwh and pct % of baseline; default { pct: 2 }. */
  threshold?: { gPerKwh?: number; pct?: number };
  /** One-sided confidence of the alert; default 0.95. */
  confidence?: number;
  /** Two-sided level of the slope interval; default 0.95. */
  level?: number;
  /** Robust weighting of the per-point drift regression; default 'huber'. */
  robust?: RobustMethod;
}

export interface DriftWindow {
  fromHours: number;
  toHours: number;
  /** Weighted mean hours since overhaul of the window's days. */
  meanHours: number;
  days: number;
  sfocGPerKwh: number;
  /** Standard error of the window mean; NaN with a single day. */
  standardErrorGPerKwh: number;
  /** Effective number of days (Σw)²/Σw², for Welch's degrees of freedom. */
  effectiveDays: number;
}

export interface DriftResult {
  referenceLoadKw: number;
  method: 'per-point' | 'windows';
  /** Days of the current overhaul cycle used. */
  days: number;
  /** Points left out: no load, no hoursSinceOverhaul, or before the last overhaul. */
  skippedPoints: number;
  /** Each used day's SFOC moved to the reference load, with its input index and hours since overhaul. */
  daySfoc: { index: number; hoursSinceOverhaul: number; sfocGPerKwh: number; weight: number }[];
  slopeGPerKwhPer1000h: number;
  slopeStandardError: number;
  slopeInterval: { lower: number; upper: number; level: number };
  /** SFOC at the reference load at 0 h since overhaul (intercept of the regression). */
  interceptGPerKwh: number;
  dof: number;
  windows: DriftWindow[];
  baseline: DriftWindow | null;
  /** The days of the last windowHours of running hours (a trailing window, not aligned to `windows`). */
  latest: DriftWindow | null;
  excessGPerKwh: number | null;
  /** One-sided lower confidence bound of the excess of the latest window over the baseline. */
  excessLowerBoundGPerKwh: number | null;
  thresholdGPerKwh: number | null;
  confidence: number;
  alert: boolean;
  /** Why no alert could be judged (e.g. the latest window is the baseline), else null. */
  alertUnavailable: string | null;
}

function summarise(rows: { h: number; s: number; w: number }[], fromHours: number, toHours: number): DriftWindow {
  let sw = 0;
  let sw2 = 0;
  let swh = 0;
  let sws = 0;
  for (const r of rows) {
    sw += r.w;
    sw2 += r.w * r.w;
    swh += r.w * r.h;
    sws += r.w * r.s;
  }
  const mean = sws / sw;
  let ss = 0;
  for (const r of rows) ss += r.w * (r.s - mean) ** 2;
  const n = rows.length;
  const effectiveDays = (sw * sw) / sw2;
  // Weighted variance with Bessel-type correction in effective days; SE of the weighted mean.
  const variance = n > 1 ? (ss / sw) * (effectiveDays / (effectiveDays - 1)) : NaN;
  return {
    fromHours,
    toHours,
    meanHours: swh / sw,
    days: n,
    sfocGPerKwh: mean,
    standardErrorGPerKwh: Math.sqrt(variance / effectiveDays),
    effectiveDays,
  };
}

/**
 * SFOC drift at a reference load against running hours since overhaul, with an alert on the latest window.
 *
 * Method: shape-corrected daily SFOC at the reference load, regressed on hours since overhaul by robust
 * weighted least squares (robustPolynomialLeastSquares, Huber by default, weights = hours run); slope interval
 * ± t_{(1+level)/2, n−2}·SE. Windows of `windowHours` for display; baseline = days below `baselineHours`;
 * latest = the days of the last `windowHours` of running hours; alert when the one-sided lower confidence
 * bound (Welch–Satterthwaite dof) of latest − baseline exceeds the threshold. Only the current overhaul cycle
 * is used: the points after the last fall of hoursSinceOverhaul (in date order when every point
 * has a date, else input order). Cost: one curve fit plus O(n log n).
 * Throws when ratedKw ≤ 0, options are out of range, or fewer than 3 days of the cycle have load and hours.
 *
 * @example fitDrift(points, { ratedKw: 1000 }).slopeGPerKwhPer1000h // e.g. 1.8
 */
export function fitDrift(points: DailyFuelPoint[], options: FitDriftOptions): DriftResult {
  const ratedKw = options.ratedKw;
  if (!(ratedKw > 0) || !Number.isFinite(ratedKw)) throw new Error('fitDrift requires ratedKw > 0');
  const referenceLoadKw = options.referenceLoadKw ?? 0.75 * ratedKw;
  if (!(referenceLoadKw > 0)) throw new Error('fitDrift requires referenceLoadKw > 0');
  const windowHours = options.windowHours ?? 500;
  if (!(windowHours > 0)) throw new Error('fitDrift requires windowHours > 0');
  const baselineHours = options.baselineHours ?? windowHours;
  const confidence = options.confidence ?? 0.95;
  const level = options.level ?? 0.95;
  if (!(confidence > 0 && confidence < 1) || !(level > 0 && level < 1)) {
    throw new Error('fitDrift requires confidence and level in (0, 1)');
  }
  const method = options.method ?? 'per-point';

  // Current overhaul cycle.
  const order = points.map((_, i) => i);
  if (points.length > 0 && points.every((p) => p.date !== undefined)) {
    order.sort((i, j) => (points[i].date! < points[j].date! ? -1 : points[i].date! > points[j].date! ? 1 : i - j));
  }
  const withHours = order.filter((i) => points[i].hoursSinceOverhaul !== undefined && Number.isFinite(points[i].hoursSinceOverhaul));
  let start = 0;
  for (let k = 1; k < withHours.length; k++) {
    if (points[withHours[k]].hoursSinceOverhaul! < points[withHours[k - 1]].hoursSinceOverhaul!) start = k;
  }
  const cycle = withHours.slice(start).filter((i) => points[i].loadKw > 0 && points[i].hoursRun > 0);
  if (cycle.length < 3) throw new Error('fitDrift requires at least 3 days with load and hoursSinceOverhaul');
  const cyclePoints = cycle.map((i) => points[i]);

  // The shape fit's robust weights are not reused: it ignores drift, so it would down-weight the late days.
  const shape = options.shape ?? fitFuelCurve(cyclePoints, { ...options.fitOptions, ratedKw });
  const refSfoc = sfocAt(shape, referenceLoadKw);
  const rows = cyclePoints.map((p, k) => ({
    index: cycle[k],
    h: p.hoursSinceOverhaul!,
    s: (1000 * p.fuelKgPerH) / p.loadKw - sfocAt(shape, p.loadKw) + refSfoc,
    w: p.hoursRun,
  }));

  // Windows of running hours.
  const windowMap = new Map<number, typeof rows>();
  for (const r of rows) {
    const k = Math.floor(r.h / windowHours);
    if (!windowMap.has(k)) windowMap.set(k, []);
    windowMap.get(k)!.push(r);
  }
  const windows = [...windowMap.entries()]
    .sort((p, q) => p[0] - q[0])
    .map(([k, rs]) => summarise(rs, k * windowHours, (k + 1) * windowHours));

  // Slope.
  let xs: number[];
  let ys: number[];
  let ws: number[];
  if (method === 'per-point') {
    xs = rows.map((r) => r.h / 1000);
    ys = rows.map((r) => r.s);
    ws = rows.map((r) => r.w);
  } else {
    const usable = windows.filter((w) => w.standardErrorGPerKwh > 0);
    if (usable.length < 3) throw new Error('fitDrift (windows) requires at least 3 windows of 2 or more days');
    xs = usable.map((w) => w.meanHours / 1000);
    ys = usable.map((w) => w.sfocGPerKwh);
    ws = usable.map((w) => 1 / w.standardErrorGPerKwh ** 2);
  }
  const reg =
    method === 'per-point'
      ? robustPolynomialLeastSquares(xs, ys, { powers: [0, 1], weights: ws, robust: options.robust ?? 'huber' })
      : robustPolynomialLeastSquares(xs, ys, { powers: [0, 1], weights: ws, robust: 'none' });
  const slope = reg.fit.coefficients[1];
  const slopeSe = reg.standardErrors[1];
  const dof = reg.fit.dof;
  const tSlope = dof > 0 ? studentTQuantile((1 + level) / 2, dof) : NaN;

  // Alert: latest window against the baseline.
  const baseRows = rows.filter((r) => r.h < baselineHours);
  const baseline = baseRows.length > 0 ? summarise(baseRows, 0, baselineHours) : null;
  const lastHours = Math.max(...rows.map((r) => r.h));
  const latestRows = rows.filter((r) => r.h > lastHours - windowHours);
  const latest = summarise(latestRows, lastHours - windowHours, lastHours);
  let excess: number | null = null;
  let lowerBound: number | null = null;
  let threshold: number | null = null;
  let unavailable: string | null = null;
  if (!baseline) unavailable = `no days in the baseline (below ${baselineHours} h since overhaul)`;
  else if (latest.fromHours < baselineHours) unavailable = 'the latest window overlaps the baseline';
  else if (!(baseline.standardErrorGPerKwh >= 0) || !(latest.standardErrorGPerKwh >= 0)) {
    unavailable = 'baseline or latest window has fewer than 2 days';
  } else {
    excess = latest.sfocGPerKwh - baseline.sfocGPerKwh;
    const vb = baseline.standardErrorGPerKwh ** 2;
    const vl = latest.standardErrorGPerKwh ** 2;
    const se = Math.sqrt(vb + vl);
    const welchDof = (vb + vl) ** 2 / (vb * vb / (baseline.effectiveDays - 1) + (vl * vl) / (latest.effectiveDays - 1));
    lowerBound = se > 0 ? excess - studentTQuantile(confidence, welchDof) * se : excess;
    const th = options.threshold ?? { pct: 2 };
    threshold = Math.max(th.gPerKwh ?? 0, ((th.pct ?? 0) / 100) * baseline.sfocGPerKwh);
  }

  return {
    referenceLoadKw,
    method,
    days: rows.length,
    skippedPoints: points.length - rows.length,
    daySfoc: rows.map((r) => ({ index: r.index, hoursSinceOverhaul: r.h, sfocGPerKwh: r.s, weight: r.w })),
    slopeGPerKwhPer1000h: slope,
    slopeStandardError: slopeSe,
    slopeInterval: { lower: slope - tSlope * slopeSe, upper: slope + tSlope * slopeSe, level },
    interceptGPerKwh: reg.fit.coefficients[0],
    dof,
    windows,
    baseline,
    latest,
    excessGPerKwh: excess,
    excessLowerBoundGPerKwh: lowerBound,
    thresholdGPerKwh: threshold,
    confidence,
    alert: lowerBound !== null && threshold !== null && lowerBound > threshold,
    alertUnavailable: unavailable,
  };
}
