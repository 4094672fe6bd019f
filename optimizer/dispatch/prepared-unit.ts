/**
 * Checked, precomputed view of one genset for the dispatch computations: load limits in kW and, for a
 * piecewise curve, the segments between the set's minimum and maximum continuous load.
 */
import { curveFuelKgPerH, maxLoadKw, minLoadKw, type GensetUnit } from '../plant';

/** One linear piece of a convex fuel curve inside a set's operating range. */
export interface OperatingSegment {
  widthKw: number;
  /** Incremental fuel on this piece, kg/kWh. */
  slopeKgPerKwh: number;
}

export interface PreparedUnit {
  unit: GensetUnit;
  minKw: number;
  maxKw: number;
  /** Fuel rate at the minimum load, kg/h. */
  fuelAtMinKgPerH: number;
  /** Piecewise curves (and straight lines, c = 0) only; ascending slope. Empty for quadratics with c > 0. */
  segments: OperatingSegment[];
  /** true: quadratic with c > 0, dispatched by its continuous incremental-cost response. */
  smooth: boolean;
  /** Linear and quadratic coefficients of a smooth curve (0 otherwise): incremental fuel is b + 2·c·P. */
  b: number;
  c: number;
}

const SLOPE_TOLERANCE = 1e-12;

/**
 * Checks one unit and precomputes its operating range and segments.
 *
 * Cost: O(k) for a piecewise curve of k breakpoints. Throws on a non-positive rating, inconsistent load
 * limits, a non-convex curve, or a piecewise curve that does not cover the operating range.
 *
 * @example prepareUnit(unit, 'dispatchLoad').maxKw // 900 for a 1000 kW set limited to 90 %
 */
export function prepareUnit(unit: GensetUnit, caller: string): PreparedUnit {
  const label = unit.name || unit.id;
  if (!(unit.ratedKw > 0) || !Number.isFinite(unit.ratedKw)) {
    throw new Error(`${caller} requires a positive rating (set ${label})`);
  }
  if (!(unit.minLoadPct >= 0) || !(unit.maxLoadPct > 0) || !(unit.minLoadPct <= unit.maxLoadPct)) {
    throw new Error(`${caller} requires 0 ≤ minLoadPct ≤ maxLoadPct and maxLoadPct > 0 (set ${label})`);
  }
  const minKw = minLoadKw(unit);
  const maxKw = maxLoadKw(unit);
  const curve = unit.curve;
  if (curve.kind === 'quadratic') {
    if (![curve.a, curve.b, curve.c].every(Number.isFinite)) {
      throw new Error(`${caller} requires finite fuel-curve coefficients (set ${label})`);
    }
    if (curve.c < 0) throw new Error(`${caller} requires convex fuel curves, c ≥ 0 (set ${label})`);
    const fuelAtMinKgPerH = curveFuelKgPerH(curve, minKw);
    if (curve.c > 0) return { unit, minKw, maxKw, fuelAtMinKgPerH, segments: [], smooth: true, b: curve.b, c: curve.c };
    const segments = maxKw > minKw ? [{ widthKw: maxKw - minKw, slopeKgPerKwh: curve.b }] : [];
    return { unit, minKw, maxKw, fuelAtMinKgPerH, segments, smooth: false, b: 0, c: 0 };
  }
  const xs = curve.breakpointsKw;
  const ys = curve.fuelKgPerH;
  if (xs.length < 2 || xs.length !== ys.length) {
    throw new Error(`${caller} requires a piecewise curve with at least 2 matching breakpoints (set ${label})`);
  }
  const span = Math.max(1, Math.abs(xs[xs.length - 1]));
  if (minKw < xs[0] - 1e-9 * span || maxKw > xs[xs.length - 1] + 1e-9 * span) {
    throw new Error(
      `${caller} requires the fuel curve of ${label} (${xs[0]} to ${xs[xs.length - 1]} kW) to cover its ` +
        `operating range ${minKw} to ${maxKw} kW`,
    );
  }
  const segments: OperatingSegment[] = [];
  let previousSlope = -Infinity;
  for (let i = 1; i < xs.length; i++) {
    if (!(xs[i] > xs[i - 1])) throw new Error(`${caller} requires strictly increasing breakpoints (set ${label})`);
    const slope = (ys[i] - ys[i - 1]) / (xs[i] - xs[i - 1]);
    if (!Number.isFinite(slope)) throw new Error(`${caller} requires finite fuel rates (set ${label})`);
    if (slope < previousSlope - SLOPE_TOLERANCE * Math.max(1, Math.abs(previousSlope))) {
      throw new Error(`${caller} requires convex fuel curves, non-decreasing slopes (set ${label})`);
    }
    previousSlope = Math.max(previousSlope, slope);
    const fromKw = Math.max(xs[i - 1], minKw);
    const toKw = Math.min(xs[i], maxKw);
    if (toKw > fromKw) segments.push({ widthKw: toKw - fromKw, slopeKgPerKwh: slope });
  }
  const fuelAtMinKgPerH = curveFuelKgPerH(curve, Math.min(Math.max(minKw, xs[0]), xs[xs.length - 1]));
  return { unit, minKw, maxKw, fuelAtMinKgPerH, segments, smooth: false, b: 0, c: 0 };
}

/** Fuel rate of a prepared unit at a load clamped to its operating range (guards rounding at the limits). */
export function preparedFuelKgPerH(p: PreparedUnit, loadKw: number): number {
  return curveFuelKgPerH(p.unit.curve, Math.min(Math.max(loadKw, p.minKw), p.maxKw));
}

/** Round for messages: at most one decimal, no trailing zeros. */
export function formatNumber(value: number, decimals = 1): string {
  return String(Number(value.toFixed(decimals)));
}
