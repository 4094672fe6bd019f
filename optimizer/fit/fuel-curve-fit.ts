/**
 * Fuel curve of one genset from daily engine-room log points: F(P) = a + b·P + c·P² (kg/h, P in kW),
 * SFOC(P) = 1000·F(P)/P (g/kWh).
 *
 * Weighted by hours run, physically bounded (a ≥ 0, c ≥ 0, solved exactly by active sets), robust by IRLS
 * (Huber k = 1.345 by default, Tukey bisquare c = 4.685 on request), optionally blended with the maker's
 * shop-test curve when the data are few or cover a narrow load range. All linear algebra goes through
 * polynomialLeastSquares (QR on a centred, scaled load).
 */
import { curveFuelKgPerH, type QuadraticFuelCurve } from '../plant';
import { HUBER_K, TUKEY_C, type RobustMethod } from './robust';
import { robustPolynomialLeastSquares } from './robust-fit';
import { studentTQuantile } from './student-t';

/** One day of one set: average load while running and the fuel rate corrected to ISO LCV. */
export interface DailyFuelPoint {
  loadKw: number;
  fuelKgPerH: number;
  /** Running hours that day: the weight of the point. 0 means the set did not run (point ignored). */
  hoursRun: number;
  date?: string;
  hoursSinceOverhaul?: number;
  id?: string;
}

/** One point of the maker's shop (test-bed) trial: load in % of rating and SFOC at ISO conditions. */
export interface ShopTestPoint {
  loadPct: number;
  sfocGPerKwh: number;
}

export interface FuelCurvePriorOptions {
  /** 'auto' (default): use the shop test when days < minDays or the load span < minLoadSpanPct. */
  use?: 'auto' | 'always' | 'never';
  /** Weight of the whole shop test in days of average running hours, before decay; default 10. */
  equivalentDays?: number;
  /** Default 30. Also the decay constant: weight = equivalentDays · minDays / (minDays + days). */
  minDays?: number;
  /** Default 20 (% of rating). */
  minLoadSpanPct?: number;
}

export interface FitFuelCurveOptions {
  ratedKw: number;
  /** 'quadratic' (default) or 'linear' (c fixed to 0). */
  model?: 'quadratic' | 'linear';
  /** Enforce a ≥ 0 and c ≥ 0 (default true). */
  constrained?: boolean;
  /** 'hours' (default): weight ∝ hours run, normalised to mean 1 over the days. 'equal': weight 1 each. */
  weighting?: 'hours' | 'equal';
  /** Default 'huber'. */
  robust?: RobustMethod;
  /** Huber k (default 1.345) or Tukey c (default 4.685). */
  robustTuning?: number;
  /** Days whose robust weight falls below this are listed as outliers; default 0.5. */
  outlierWeightBelow?: number;
  shopTest?: ShopTestPoint[];
  prior?: FuelCurvePriorOptions;
  /** Loads (% of rating) reported in `atLoads`; default [50, 75, 85, 100]. */
  reportLoadPcts?: number[];
  /** Confidence level of the bands in `atLoads`; default 0.95. */
  level?: number;
  /** Lowest load considered for the load of lowest SFOC, % of rating; default 10. */
  minLoadPct?: number;
  /** IRLS iteration cap; default 50. */
  maxIterations?: number;
}

export interface OutlierDay {
  /** Index into the input points. */
  index: number;
  id?: string;
  date?: string;
  loadKw: number;
  fuelKgPerH: number;
  residualKgPerH: number;
  /** Residual / (robust scale / √weight). */
  standardizedResidual: number;
  robustWeight: number;
}

export interface SfocBand {
  loadKw: number;
  sfocGPerKwh: number;
  lowerGPerKwh: number;
  upperGPerKwh: number;
  /** The load lies outside the load range of the days fitted. */
  extrapolated: boolean;
}

export interface SfocAtLoad extends SfocBand {
  loadPct: number;
  /** Shop-test SFOC interpolated linearly in load; null outside the shop test's loads or without one. */
  shopSfocGPerKwh: number | null;
  offsetFromShopGPerKwh: number | null;
}

export interface FuelCurveFit {
  curve: QuadraticFuelCurve;
  ratedKw: number;
  coefficients: { a: number; b: number; c: number };
  standardErrors: { a: number; b: number; c: number };
  /** Covariance of (a, b, c) in kg/h, kg/h/kW, kg/h/kW² units; order a, b, c. */
  covariance: number[][];
  /** Coefficients held at 0 by their bound. */
  activeConstraints: ('a' | 'c')[];
  rSquared: number;
  /** Residual SD of a day of average running hours, kg/h (robust fits: normalised MAD). NaN when dof = 0. */
  residualSdKgPerH: number;
  dof: number;
  /** Days with load that entered the fit. */
  days: number;
  loadRangeKw: { min: number; max: number };
  loadSpanPct: number;
  /** Final weight per input point (base × robust); 0 for points without load. */
  effectiveWeights: number[];
  /** Robust weight per input point; 1 for points without load. */
  robustWeights: number[];
  outliers: OutlierDay[];
  robust: RobustMethod;
  robustTuning: number | null;
  iterations: number;
  converged: boolean;
  priorUsed: boolean;
  /** Weight of the shop test in days of average running hours (0 when not used). */
  priorWeightDays: number;
  /** Share of the total weight carried by the shop-test points. */
  priorWeightShare: number;
  lowestSfoc: { loadKw: number; sfocGPerKwh: number; extrapolated: boolean };
  atLoads: SfocAtLoad[];
  warnings: string[];
}

function shopSfocAt(shop: ShopTestPoint[] | undefined, loadPct: number): number | null {
  if (!shop || shop.length === 0) return null;
  const sorted = [...shop].sort((p, q) => p.loadPct - q.loadPct);
  const tol = 1e-9;
  if (loadPct < sorted[0].loadPct - tol || loadPct > sorted[sorted.length - 1].loadPct + tol) return null;
  for (let i = 0; i < sorted.length - 1; i++) {
    const lo = sorted[i];
    const hi = sorted[i + 1];
    if (loadPct <= hi.loadPct + tol) {
      if (hi.loadPct === lo.loadPct) return lo.sfocGPerKwh;
      const t = Math.min(1, Math.max(0, (loadPct - lo.loadPct) / (hi.loadPct - lo.loadPct)));
      return lo.sfocGPerKwh + t * (hi.sfocGPerKwh - lo.sfocGPerKwh);
    }
  }
  return sorted[sorted.length - 1].sfocGPerKwh;
}

function checkFinite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new Error(`fitFuelCurve requires finite ${what}`);
}

/**
 * Fit the fuel curve of one genset to its daily log points.
 *
 * Method: weighted least squares by QR on a centred, scaled load (polynomialLeastSquares), with a ≥ 0, c ≥ 0
 * enforced by exact active-set enumeration (boundedPolynomialLeastSquares), made robust by IRLS on
 * MAD-scaled residuals (Huber & Ronchetti, Robust Statistics, §7.8): Huber k = 1.345 by default; 'tukey' runs
 * Huber to convergence first, then bisquare c = 4.685. Down-weighted days stay in the fit with their weight
 * and are listed in `outliers`. When days < 30 or the load span < 20 % of rating and a shop test is given,
 * its points enter as pseudo-observations of total weight equivalentDays · 30 / (30 + days) average days.
 * Standard errors: Huber's M-estimate covariance for robust fits (robustPolynomialLeastSquares), the weighted
 * fit's σ̂²(XᵀWX)⁻¹ otherwise; conditional on the active set; dof = days + shop points − free coefficients.
 * Cost: O(n) per IRLS iteration and face (≤ 4 faces), typically 5–20 iterations.
 * Throws on non-finite or negative inputs, ratedKw ≤ 0, fewer than 3 days with load, or too few distinct loads.
 *
 * @example
 * const fit = fitFuelCurve([{ loadKw: 400, fuelKgPerH: 90, hoursRun: 20 }, …], { ratedKw: 1000 });
 * sfocAt(fit, 750); // g/kWh
 */
export function fitFuelCurve(points: DailyFuelPoint[], options: FitFuelCurveOptions): FuelCurveFit {
  const ratedKw = options.ratedKw;
  if (!(ratedKw > 0) || !Number.isFinite(ratedKw)) throw new Error('fitFuelCurve requires ratedKw > 0');
  const model = options.model ?? 'quadratic';
  const constrained = options.constrained ?? true;
  const weighting = options.weighting ?? 'hours';
  const robust = options.robust ?? 'huber';
  const tuning = robust === 'none' ? null : (options.robustTuning ?? (robust === 'huber' ? HUBER_K : TUKEY_C));
  const outlierBelow = options.outlierWeightBelow ?? 0.5;
  const level = options.level ?? 0.95;
  const maxIterations = options.maxIterations ?? 50;
  const warnings: string[] = [];

  const dayIndex: number[] = [];
  for (let i = 0; i < points.length; i++) {
    const pt = points[i];
    checkFinite(pt.loadKw, 'loadKw');
    checkFinite(pt.fuelKgPerH, 'fuelKgPerH');
    checkFinite(pt.hoursRun, 'hoursRun');
    if (pt.loadKw < 0 || pt.fuelKgPerH < 0 || pt.hoursRun < 0) {
      throw new Error(`fitFuelCurve requires loadKw, fuelKgPerH and hoursRun ≥ 0 (point ${i})`);
    }
    if (pt.hoursRun > 0 && pt.loadKw > 0) dayIndex.push(i);
  }
  const nDays = dayIndex.length;
  if (nDays < 3) throw new Error('fitFuelCurve requires at least 3 days with load');

  let meanHours = 0;
  for (const i of dayIndex) meanHours += points[i].hoursRun / nDays;
  let loadMin = Infinity;
  let loadMax = -Infinity;
  for (const i of dayIndex) {
    loadMin = Math.min(loadMin, points[i].loadKw);
    loadMax = Math.max(loadMax, points[i].loadKw);
  }
  const loadSpanPct = (100 * (loadMax - loadMin)) / ratedKw;

  // Prior (shop test as pseudo-observations).
  const prior = options.prior ?? {};
  const priorUse = prior.use ?? 'auto';
  const minDays = prior.minDays ?? 30;
  const minSpanPct = prior.minLoadSpanPct ?? 20;
  const equivalentDays = prior.equivalentDays ?? 10;
  const shop = options.shopTest ?? [];
  for (const sp of shop) {
    checkFinite(sp.loadPct, 'shop-test loadPct');
    checkFinite(sp.sfocGPerKwh, 'shop-test sfocGPerKwh');
    if (!(sp.loadPct > 0) || !(sp.sfocGPerKwh > 0)) throw new Error('fitFuelCurve requires shop-test loadPct and sfocGPerKwh > 0');
  }
  const dataThin = nDays < minDays || loadSpanPct < minSpanPct;
  const priorUsed = shop.length > 0 && (priorUse === 'always' || (priorUse === 'auto' && dataThin));
  if (priorUse === 'always' && shop.length === 0) warnings.push('prior requested but no shop test given');
  if (dataThin && !priorUsed) {
    warnings.push(`few days (${nDays}) or narrow load span (${loadSpanPct.toFixed(1)} % of rating) and no shop-test prior: curvature poorly determined`);
  }
  const priorWeightDays = priorUsed ? (equivalentDays * minDays) / (minDays + nDays) : 0;

  const x: number[] = [];
  const y: number[] = [];
  const baseW: number[] = [];
  for (const i of dayIndex) {
    x.push(points[i].loadKw);
    y.push(points[i].fuelKgPerH);
    baseW.push(weighting === 'hours' ? points[i].hoursRun / meanHours : 1);
  }
  if (priorUsed) {
    for (const sp of shop) {
      const loadKw = (sp.loadPct * ratedKw) / 100;
      x.push(loadKw);
      y.push((sp.sfocGPerKwh * loadKw) / 1000);
      baseW.push(priorWeightDays / shop.length);
    }
  }
  const nObs = x.length;
  const powers = model === 'linear' ? [0, 1] : [0, 1, 2];
  const distinct = new Set(x).size;
  if (distinct < powers.length) {
    throw new Error(`fitFuelCurve requires at least ${powers.length} distinct loads (days or shop-test points)`);
  }

  // IRLS. Shop-test points (after the days) keep robust weight 1 and do not enter the scale.
  const irls = robustPolynomialLeastSquares(x, y, {
    powers,
    weights: baseW,
    nonNegative: constrained ? powers.filter((q) => q !== 1) : [],
    robust,
    tuning: tuning ?? undefined,
    robustCount: nDays,
    maxIterations,
  });
  const res = irls.fit;
  const u = irls.robustWeights;
  const w = irls.finalWeights;
  if (!irls.converged) warnings.push(`robust iterations did not converge in ${maxIterations} steps`);
  const [a, b, c] = [res.coefficients[0], res.coefficients[1], res.coefficients[2] ?? 0];
  const cov3 = [0, 1, 2].map((i) => [0, 1, 2].map((j) => irls.covariance[i]?.[j] ?? 0));
  const curve: QuadraticFuelCurve = { kind: 'quadratic', a, b, c };

  const effectiveWeights = new Array<number>(points.length).fill(0);
  const robustWeights = new Array<number>(points.length).fill(1);
  const outliers: OutlierDay[] = [];
  for (let j = 0; j < nDays; j++) {
    const i = dayIndex[j];
    effectiveWeights[i] = w[j];
    robustWeights[i] = u[j];
    if (robust !== 'none' && u[j] < outlierBelow) {
      outliers.push({
        index: i,
        id: points[i].id,
        date: points[i].date,
        loadKw: points[i].loadKw,
        fuelKgPerH: points[i].fuelKgPerH,
        residualKgPerH: res.residuals[j],
        standardizedResidual: irls.standardizedResiduals[j],
        robustWeight: u[j],
      });
    }
  }
  let totalW = 0;
  let priorW = 0;
  for (let j = 0; j < nObs; j++) {
    totalW += w[j];
    if (j >= nDays) priorW += w[j];
  }
  if (res.dof === 0) warnings.push('no residual degrees of freedom: standard errors and bands are not available');

  const fitCore = { curve, ratedKw, covariance: cov3, dof: res.dof, loadRangeKw: { min: loadMin, max: loadMax } };
  const minLoadKw = ((options.minLoadPct ?? 10) * ratedKw) / 100;
  const lowest = lowestSfocLoad(curve, minLoadKw, ratedKw);
  const atLoads = (options.reportLoadPcts ?? [50, 75, 85, 100]).map((loadPct): SfocAtLoad => {
    const band = sfocBandAt(fitCore, (loadPct * ratedKw) / 100, level);
    const shopSfoc = shopSfocAt(shop, loadPct);
    return { ...band, loadPct, shopSfocGPerKwh: shopSfoc, offsetFromShopGPerKwh: shopSfoc === null ? null : band.sfocGPerKwh - shopSfoc };
  });

  return {
    ...fitCore,
    coefficients: { a, b, c },
    standardErrors: { a: Math.sqrt(cov3[0][0]), b: Math.sqrt(cov3[1][1]), c: Math.sqrt(cov3[2][2]) },
    activeConstraints: res.activeAtZero.map((q) => (q === 0 ? 'a' : 'c')),
    rSquared: res.rSquared,
    residualSdKgPerH: irls.residualSd,
    days: nDays,
    loadSpanPct,
    effectiveWeights,
    robustWeights,
    outliers,
    robust,
    robustTuning: tuning,
    iterations: irls.iterations,
    converged: irls.converged,
    priorUsed,
    priorWeightDays,
    priorWeightShare: priorW / totalW,
    lowestSfoc: { loadKw: lowest, sfocGPerKwh: sfocOfCurve(curve, lowest), extrapolated: lowest < loadMin || lowest > loadMax },
    atLoads,
    warnings,
  };
}

/** What the evaluation functions need from a fit. */
export type FittedCurve = Pick<FuelCurveFit, 'curve' | 'covariance' | 'dof' | 'loadRangeKw'>;

function sfocOfCurve(curve: QuadraticFuelCurve, loadKw: number): number {
  return (1000 * curveFuelKgPerH(curve, loadKw)) / loadKw;
}

function lowestSfocLoad(curve: QuadraticFuelCurve, lowKw: number, highKw: number): number {
  const candidates = [lowKw, highKw];
  if (curve.c !== 0 && curve.a / curve.c > 0) {
    const p = Math.sqrt(curve.a / curve.c);
    if (p > lowKw && p < highKw) candidates.push(p);
  }
  let best = candidates[0];
  for (const p of candidates) if (sfocOfCurve(curve, p) < sfocOfCurve(curve, best)) best = p;
  return best;
}

/**
 * Load of lowest SFOC of a fitted curve within [minLoadPct, 100] % of rating.
 *
 * SFOC(P) = 1000(a/P + b + cP) has its stationary point at P = √(a/c) (minimum when a, c > 0); the result is
 * that point clamped to the range, or the better end of the range otherwise. Cost: O(1). Throws when
 * minLoadPct is not in (0, 100).
 *
 * @example lowestSfocLoadKw({ curve: { kind: 'quadratic', a: 20, b: 0.17, c: 5e-5 } }, 1000) // 632.5…
 */
export function lowestSfocLoadKw(fit: Pick<FuelCurveFit, 'curve'>, ratedKw: number, minLoadPct = 10): number {
  if (!(minLoadPct > 0 && minLoadPct < 100)) throw new Error('lowestSfocLoadKw requires 0 < minLoadPct < 100');
  if (!(ratedKw > 0)) throw new Error('lowestSfocLoadKw requires ratedKw > 0');
  return lowestSfocLoad(fit.curve, (minLoadPct * ratedKw) / 100, ratedKw);
}

/**
 * Fuel rate of the fitted curve at a load, kg/h.
 *
 * Cost: O(1). Throws when loadKw is not finite.
 *
 * @example fuelRateAt({ curve: { kind: 'quadratic', a: 20, b: 0.19, c: 2e-5 } }, 1000) // 230
 */
export function fuelRateAt(fit: Pick<FuelCurveFit, 'curve'>, loadKw: number): number {
  if (!Number.isFinite(loadKw)) throw new Error('fuelRateAt requires a finite loadKw');
  return curveFuelKgPerH(fit.curve, loadKw);
}

/**
 * SFOC of the fitted curve at a load: 1000·F(P)/P, g/kWh.
 *
 * Cost: O(1). Throws when loadKw ≤ 0.
 *
 * @example sfocAt({ curve: { kind: 'quadratic', a: 20, b: 0.19, c: 2e-5 } }, 1000) // 230
 */
export function sfocAt(fit: Pick<FuelCurveFit, 'curve'>, loadKw: number): number {
  if (!(loadKw > 0) || !Number.isFinite(loadKw)) throw new Error('sfocAt requires loadKw > 0');
  return sfocOfCurve(fit.curve, loadKw);
}

/**
 * Confidence band of the mean SFOC at a load: SFOC ± t_{(1+level)/2, dof} · 1000·√(gᵀΣg)/P with g = (1, P, P²).
 *
 * Reference: delta method (Seber & Lee, Linear Regression Analysis, §5.1 — confidence interval for a mean
 * response); exact here because SFOC at a fixed load is linear in (a, b, c). Student t quantile from
 * studentTQuantile. Cost: O(1) plus one t quantile. NaN bounds when dof = 0.
 * Throws when loadKw ≤ 0 or level is not in (0, 1).
 *
 * @example sfocBandAt(fit, 750) // { sfocGPerKwh: 201.3, lowerGPerKwh: 200.9, upperGPerKwh: 201.7, … }
 */
export function sfocBandAt(fit: FittedCurve, loadKw: number, level = 0.95): SfocBand {
  if (!(loadKw > 0) || !Number.isFinite(loadKw)) throw new Error('sfocBandAt requires loadKw > 0');
  if (!(level > 0 && level < 1)) throw new Error('sfocBandAt requires 0 < level < 1');
  const g = [1, loadKw, loadKw * loadKw];
  let variance = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) variance += g[i] * fit.covariance[i][j] * g[j];
  const sfoc = sfocOfCurve(fit.curve, loadKw);
  const t = fit.dof > 0 ? studentTQuantile((1 + level) / 2, fit.dof) : NaN;
  const half = (1000 * t * Math.sqrt(Math.max(0, variance))) / loadKw;
  return {
    loadKw,
    sfocGPerKwh: sfoc,
    lowerGPerKwh: sfoc - half,
    upperGPerKwh: sfoc + half,
    extrapolated: loadKw < fit.loadRangeKw.min || loadKw > fit.loadRangeKw.max,
  };
}

/**
 * Bias of a fuel rate computed from the daily average load when the load varies within the day:
 * E[F(P)] − F(E[P]) = c·Var(P) for the quadratic curve (Jensen's inequality; exact for a quadratic).
 *
 * So a day's fuel computed as F(daily mean load) is c·σ² kg/h low, σ the within-day load SD; conversely a
 * curve fitted to daily means absorbs the record's mean c·σ² into its intercept and reads that much high for a
 * steady load (and tilts b, c when σ varies with load). Cost: O(1). Throws when loadSdKw < 0.
 *
 * @example withinDayFuelBiasKgPerH({ kind: 'quadratic', a: 20, b: 0.17, c: 5e-5 }, 100) // 0.5
 */
export function withinDayFuelBiasKgPerH(curve: QuadraticFuelCurve, loadSdKw: number): number {
  if (!(loadSdKw >= 0) || !Number.isFinite(loadSdKw)) throw new Error('withinDayFuelBiasKgPerH requires loadSdKw ≥ 0');
  return curve.c * loadSdKw * loadSdKw;
}
