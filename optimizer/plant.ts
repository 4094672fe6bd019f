/**
 * Plant description shared by the dispatch, plan and savings computations.
 *
 * Units are part of every name: kW for electrical load, kg/h for fuel rate, h for time.
 * A fuel curve gives the fuel rate of one running set as a convex function of its load.
 */

/** Fuel rate F(P) = a + b·P + c·P² (kg/h, P in kW). Convex when c ≥ 0. */
export interface QuadraticFuelCurve {
  kind: 'quadratic';
  a: number;
  b: number;
  c: number;
}

/**
 * Piecewise-linear fuel curve through (breakpointsKw[i], fuelKgPerH[i]); breakpoints strictly increasing,
 * slopes non-decreasing (convex). Used for the chord-segment MILP models.
 */
export interface PiecewiseFuelCurve {
  kind: 'piecewise';
  breakpointsKw: number[];
  fuelKgPerH: number[];
}

export type FuelCurve = QuadraticFuelCurve | PiecewiseFuelCurve;

/** One generating set as the recommendation sees it. */
export interface GensetUnit {
  id: string;
  /** Designation shown to users, e.g. "DG1". */
  name: string;
  ratedKw: number;
  /** Lowest load the set may run at while online, % of rating. */
  minLoadPct: number;
  /** Highest continuous load, % of rating. */
  maxLoadPct: number;
  curve: FuelCurve;
  /** Bus section the set feeds, e.g. "A". */
  busSection: string;
  /** false: maintenance or defect; never runs. */
  available: boolean;
  /** true: always runs (e.g. ordered by the chief engineer). */
  mustRun: boolean;
  /** Fuel burned by one start, kg (fuel equivalent of the start cost). */
  startCostKg: number;
  minUpH: number;
  minDownH: number;
}

/** Spinning-reserve rule of one operating mode. */
export interface ReserveRule {
  /** Online capacity above the load, kW (absolute margin). */
  marginKw: number;
  /** Online capacity above the load, % of the load. The larger of the two margins applies. */
  marginPct: number;
  /** Minimum number of sets online (per bus section when the bus tie is open). */
  minSets: number;
  /** When true, losing the largest running set must leave enough maximum continuous capacity for the load. */
  nMinus1: boolean;
  /** Bus tie closed: all sections share load. Open: each section carries its own load and reserve. */
  busTieClosed: boolean;
}

/** Operating modes a vessel logs hours in. Shore power means no set runs. */
export const OPERATING_MODES = ['sea', 'manoeuvring', 'port', 'anchorage'] as const;
export type OperatingMode = (typeof OPERATING_MODES)[number];

export function minLoadKw(unit: GensetUnit): number {
  return (unit.ratedKw * unit.minLoadPct) / 100;
}

export function maxLoadKw(unit: GensetUnit): number {
  return (unit.ratedKw * unit.maxLoadPct) / 100;
}

/**
 * Fuel rate of a curve at a load.
 *
 * Cost: O(1) for quadratic, O(log n) for piecewise. Throws when the load lies outside a piecewise curve's
 * breakpoints (a quadratic is defined everywhere).
 *
 * @example curveFuelKgPerH({ kind: 'quadratic', a: 20, b: 0.19, c: 2e-5 }, 1000) // 230
 */
export function curveFuelKgPerH(curve: FuelCurve, loadKw: number): number {
  if (curve.kind === 'quadratic') return curve.a + curve.b * loadKw + curve.c * loadKw * loadKw;
  const xs = curve.breakpointsKw;
  const ys = curve.fuelKgPerH;
  const n = xs.length;
  const tol = 1e-9 * Math.max(1, Math.abs(xs[n - 1]));
  if (loadKw < xs[0] - tol || loadKw > xs[n - 1] + tol) {
    throw new Error(`curveFuelKgPerH: load ${loadKw} kW outside the curve's range ${xs[0]} to ${xs[n - 1]} kW`);
  }
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= loadKw) lo = mid;
    else hi = mid;
  }
  const t = (loadKw - xs[lo]) / (xs[hi] - xs[lo]);
  return ys[lo] + t * (ys[hi] - ys[lo]);
}

/**
 * Chord-segment approximation of a quadratic curve between two loads: `segments` equal chords.
 * A chord of a convex function lies above it, so the result overestimates by at most c·(w/2)² for chord width w.
 *
 * @example chordCurve({ kind: 'quadratic', a: 0, b: 0, c: 1 }, 0, 2, 2).fuelKgPerH // [0, 1, 4]
 */
export function chordCurve(curve: QuadraticFuelCurve, fromKw: number, toKw: number, segments: number): PiecewiseFuelCurve {
  if (!(segments >= 1) || !Number.isInteger(segments)) throw new Error('chordCurve requires a whole number of segments ≥ 1');
  if (!(toKw > fromKw)) throw new Error('chordCurve requires toKw > fromKw');
  const breakpointsKw: number[] = [];
  const fuelKgPerH: number[] = [];
  for (let i = 0; i <= segments; i++) {
    const p = fromKw + ((toKw - fromKw) * i) / segments;
    breakpointsKw.push(p);
    fuelKgPerH.push(curveFuelKgPerH(curve, p));
  }
  return { kind: 'piecewise', breakpointsKw, fuelKgPerH };
}
