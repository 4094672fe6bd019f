/**
 * Adoption of the recommendations: plant fuel per kWh before and after the date from which a vessel follows them,
 * normalised for load by regression.
 */
import { inverse, Matrix, QrDecomposition } from 'ml-matrix';
import type { GensetUnit } from '../plant';
import type { DaySavings } from './types';
import { criticalValue } from './uncertainty';

/** One day of the plant as the adoption comparison sees it. */
export interface AdoptionPoint {
  date: string;
  energyKwh: number;
  /** Measured fuel, kg. */
  fuelKg: number;
  /** Average plant load / installed capacity of the sets available that day (0..1). */
  loadFraction: number;
}

export interface AdoptionOptions {
  /** 'quadratic' (default): SFOC = β0 + β1·x + β2·x² + δ·after; 'linear': without x². */
  loadModel?: 'linear' | 'quadratic';
  level?: number;
}

export interface AdoptionEffect {
  adoptedFrom: string;
  daysBefore: number;
  daysAfter: number;
  /** Energy-weighted plant SFOC (Σ fuel / Σ kWh) before and after, g/kWh, not normalised. */
  rawSfocBeforeGPerKwh: number;
  rawSfocAfterGPerKwh: number;
  /** δ: change of daily plant SFOC at the same load fraction, g/kWh (negative = less fuel after). */
  changeGPerKwh: number;
  changeLowerGPerKwh: number;
  changeUpperGPerKwh: number;
  changeSdGPerKwh: number;
  /** δ as % of the before-model's SFOC at the mean load fraction of the days after. */
  changePct: number;
  /** −δ × energy after, t (positive = fuel saved after adoption), with the interval of δ. */
  fuelSavedAfterT: { value: number; lower: number; upper: number };
  dof: number;
  level: number;
  /** β of 1, x (, x²), after in that order. */
  coefficients: number[];
  covariance: number[][];
  residualSdGPerKwh: number;
  loadFractionRange: { before: [number, number]; after: [number, number] };
  warnings: string[];
}

/**
 * Adoption points from costed days: measured fuel, energy and the load fraction on the installed capacity of
 * the sets available that day. Days without measured fuel or energy are dropped.
 *
 * Cost: O(days · N). Throws when units is empty.
 *
 * @example adoptionPointsFromDays(vesselSavings(input).days, input.units, unavailableByDate)
 */
export function adoptionPointsFromDays(days: DaySavings[], units: GensetUnit[], unavailableByDate: Record<string, string[]> = {}): AdoptionPoint[] {
  if (units.length === 0) throw new Error('adoptionPointsFromDays requires at least one unit');
  const out: AdoptionPoint[] = [];
  for (const d of days) {
    if (d.measuredFuelKg === null || !(d.energyKwh > 0) || !(d.plantHours > 0)) continue;
    const off = new Set(unavailableByDate[d.date] ?? []);
    const capacityKw = units.filter((u) => u.available && !off.has(u.id)).reduce((s, u) => s + u.ratedKw, 0);
    if (!(capacityKw > 0)) continue;
    out.push({ date: d.date, energyKwh: d.energyKwh, fuelKg: d.measuredFuelKg, loadFraction: d.averageLoadKw / capacityKw });
  }
  return out;
}

/**
 * Change of plant fuel per kWh after adoption, normalised for load: ordinary least squares of the daily plant
 * SFOC (1000 · fuel / kWh, g/kWh) on the load fraction x (and x²) with an indicator of the days from
 * `adoptedFrom` on, SFOC = β0 + β1·x (+ β2·x²) + δ·after + ε (analysis of covariance; Montgomery, Design and
 * Analysis of Experiments, ch. 15, analysis of covariance). δ is the change at the same load; its interval is
 * δ ± t_{(1+level)/2, n−p} · s·√[(XᵀX)⁻¹]_δδ (Seber & Lee, Linear Regression Analysis, §5.1). Solved by QR
 * (ml-matrix). Assumes the load-SFOC relation of the plant is the same shape before and after, days independent.
 *
 * Cost: O(n·p²). Throws on bad points, fewer than 2 days on either side, fewer days than coefficients + 2, or a
 * rank-deficient design (e.g. one load fraction only).
 *
 * @example adoptionEffect(points, '2024-06-01').changeGPerKwh // e.g. −4.1 g/kWh
 */
export function adoptionEffect(points: AdoptionPoint[], adoptedFrom: string, options: AdoptionOptions = {}): AdoptionEffect {
  const caller = 'adoptionEffect';
  const level = options.level ?? 0.95;
  const quadratic = (options.loadModel ?? 'quadratic') === 'quadratic';
  if (!/^\d{4}-\d{2}-\d{2}$/.test(adoptedFrom)) throw new Error(`${caller} requires adoptedFrom as an ISO date YYYY-MM-DD`);
  for (const p of points) {
    if (!(p.energyKwh > 0) || !(p.fuelKg >= 0) || !(p.loadFraction > 0) || ![p.energyKwh, p.fuelKg, p.loadFraction].every(Number.isFinite)) {
      throw new Error(`${caller} requires energyKwh > 0, fuelKg ≥ 0 and loadFraction > 0 (day ${p.date})`);
    }
  }
  const after = points.map((p) => (p.date >= adoptedFrom ? 1 : 0));
  const nAfter = after.reduce<number>((s, a) => s + a, 0);
  const nBefore = points.length - nAfter;
  if (nBefore < 2 || nAfter < 2) throw new Error(`${caller} requires at least 2 days before and 2 days after the adoption date`);
  const rows = points.map((p, i) => (quadratic ? [1, p.loadFraction, p.loadFraction ** 2, after[i]] : [1, p.loadFraction, after[i]]));
  const nCoef = rows[0].length;
  if (points.length < nCoef + 2) throw new Error(`${caller} requires at least ${nCoef + 2} days`);
  const sfoc = points.map((p) => (1000 * p.fuelKg) / p.energyKwh);
  const x = new Matrix(rows);
  const qr = new QrDecomposition(x);
  if (!qr.isFullRank()) throw new Error(`${caller} requires days at several load fractions on both sides (rank-deficient design)`);
  const beta = qr.solve(Matrix.columnVector(sfoc)).to1DArray();
  const fitted = rows.map((r) => r.reduce((s, v, j) => s + v * beta[j], 0));
  const dof = points.length - nCoef;
  const rss = sfoc.reduce((s, y, i) => s + (y - fitted[i]) ** 2, 0);
  const s2 = rss / dof;
  const covariance = inverse(x.transpose().mmul(x)).mul(s2).to2DArray();
  const k = nCoef - 1;
  const delta = beta[k];
  const sd = Math.sqrt(Math.max(0, covariance[k][k]));
  const half = criticalValue(level, dof) * sd;

  const sum = (sel: number) => points.reduce((acc, p, i) => (after[i] === sel ? { f: acc.f + p.fuelKg, e: acc.e + p.energyKwh } : acc), { f: 0, e: 0 });
  const before = sum(0);
  const afterSum = sum(1);
  const meanXAfter = points.reduce((s, p, i) => s + (after[i] ? p.loadFraction : 0), 0) / nAfter;
  const baseline = beta[0] + beta[1] * meanXAfter + (quadratic ? beta[2] * meanXAfter ** 2 : 0);
  const range = (sel: number): [number, number] => {
    const xs = points.filter((_, i) => after[i] === sel).map((p) => p.loadFraction);
    return [Math.min(...xs), Math.max(...xs)];
  };
  const rb = range(0);
  const ra = range(1);
  const warnings: string[] = [];
  if (ra[0] > rb[1] || ra[1] < rb[0]) warnings.push('the load fractions before and after do not overlap: the comparison extrapolates the load model');
  const tonnesPerGPerKwh = afterSum.e / 1e6; // g/kWh × kWh = g; / 1e6 = t
  return {
    adoptedFrom,
    daysBefore: nBefore,
    daysAfter: nAfter,
    rawSfocBeforeGPerKwh: (1000 * before.f) / before.e,
    rawSfocAfterGPerKwh: (1000 * afterSum.f) / afterSum.e,
    changeGPerKwh: delta,
    changeLowerGPerKwh: delta - half,
    changeUpperGPerKwh: delta + half,
    changeSdGPerKwh: sd,
    changePct: (100 * delta) / baseline,
    fuelSavedAfterT: { value: -delta * tonnesPerGPerKwh, lower: -(delta + half) * tonnesPerGPerKwh, upper: -(delta - half) * tonnesPerGPerKwh },
    dof,
    level,
    coefficients: beta,
    covariance,
    residualSdGPerKwh: Math.sqrt(s2),
    loadFractionRange: { before: rb, after: ra },
    warnings,
  };
}
