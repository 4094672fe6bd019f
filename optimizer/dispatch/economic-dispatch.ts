/**
 * Economic dispatch of a given set of running gensets: how to split one load among them for the least fuel.
 */
import type { GensetUnit } from '../plant';
import { formatNumber, prepareUnit, preparedFuelKgPerH, type PreparedUnit } from './prepared-unit';

/** Load and fuel of one running set. */
export interface UnitLoad {
  id: string;
  name: string;
  busSection: string;
  loadKw: number;
  /** Load as % of rating. */
  loadPct: number;
  fuelKgPerH: number;
  /** Specific fuel oil consumption at this load, g/kWh; null at zero load. */
  sfocGPerKwh: number | null;
}

export interface DispatchFeasible {
  feasible: true;
  loadKw: number;
  units: UnitLoad[];
  fuelKgPerH: number;
  /** Plant SFOC, g/kWh; null at zero load. */
  sfocGPerKwh: number | null;
  /** Incremental fuel of the next kW (equal incremental cost), kg/kWh; null for equal split or no free set. */
  lambdaKgPerKwh: number | null;
}

export type DispatchFailureRule = 'below-minimum' | 'above-maximum' | 'equal-split-limit';

export interface DispatchInfeasible {
  feasible: false;
  loadKw: number;
  rule: DispatchFailureRule;
  reason: string;
  /** Sum of minimum loads of the sets, kW. */
  minKw: number;
  /** Sum of maximum continuous loads of the sets, kW. */
  maxKw: number;
}

export type DispatchResult = DispatchFeasible | DispatchInfeasible;

export interface DispatchOptions {
  /** Relative tolerance of the equal-incremental-cost bisection on lambda. Default 1e-9. */
  lambdaRelTol?: number;
}

const DEFAULT_LAMBDA_REL_TOL = 1e-9;
const MAX_BISECTIONS = 200;

/** Checks load and units, throwing on bad input; shared by the exported entry points. */
export function prepareUnits(units: GensetUnit[], caller: string): PreparedUnit[] {
  if (!Array.isArray(units)) throw new Error(`${caller} requires an array of units`);
  const seen = new Set<string>();
  return units.map((u) => {
    if (seen.has(u.id)) throw new Error(`${caller} requires unique unit ids (duplicate ${u.id})`);
    seen.add(u.id);
    return prepareUnit(u, caller);
  });
}

function checkLoad(loadKw: number, caller: string): void {
  if (!Number.isFinite(loadKw) || loadKw < 0) throw new Error(`${caller} requires a finite load ≥ 0 kW`);
}

function limitTolKw(maxKw: number): number {
  return 1e-9 * Math.max(1, maxKw);
}

function names(prepared: PreparedUnit[]): string {
  return prepared.map((p) => p.unit.name || p.unit.id).join(' + ') || 'no set';
}

/** Feasibility of a load against the sums of the limits; null when within them. */
export function limitFailure(prepared: PreparedUnit[], loadKw: number): DispatchInfeasible | null {
  let minKw = 0;
  let maxKw = 0;
  for (const p of prepared) {
    minKw += p.minKw;
    maxKw += p.maxKw;
  }
  const tol = limitTolKw(maxKw);
  if (loadKw > maxKw + tol) {
    const reason =
      `load ${formatNumber(loadKw)} kW exceeds the ${formatNumber(maxKw)} kW maximum continuous capacity of ` +
      names(prepared);
    return { feasible: false, loadKw, rule: 'above-maximum', reason, minKw, maxKw };
  }
  if (loadKw < minKw - tol) {
    const reason =
      `load ${formatNumber(loadKw)} kW is below the ${formatNumber(minKw)} kW sum of minimum loads of ` + names(prepared);
    return { feasible: false, loadKw, rule: 'below-minimum', reason, minKw, maxKw };
  }
  return null;
}

function unitLoad(p: PreparedUnit, loadKw: number): UnitLoad {
  const fuelKgPerH = preparedFuelKgPerH(p, loadKw);
  return {
    id: p.unit.id,
    name: p.unit.name,
    busSection: p.unit.busSection,
    loadKw,
    loadPct: (loadKw / p.unit.ratedKw) * 100,
    fuelKgPerH,
    sfocGPerKwh: loadKw > 0 ? (fuelKgPerH * 1000) / loadKw : null,
  };
}

function assemble(prepared: PreparedUnit[], loadsKw: number[], loadKw: number, lambda: number | null): DispatchFeasible {
  const units = prepared.map((p, i) => unitLoad(p, loadsKw[i]));
  let fuelKgPerH = 0;
  for (const u of units) fuelKgPerH += u.fuelKgPerH;
  return {
    feasible: true,
    loadKw,
    units,
    fuelKgPerH,
    sfocGPerKwh: loadKw > 0 ? (fuelKgPerH * 1000) / loadKw : null,
    lambdaKgPerKwh: lambda,
  };
}

/** Merit-order fill of all segments above the minima (exact for convex piecewise-linear curves). */
function fillSegments(prepared: PreparedUnit[], loadKw: number): { loadsKw: number[]; lambda: number | null } {
  const loadsKw = prepared.map((p) => p.minKw);
  const pieces: { unit: number; widthKw: number; slope: number }[] = [];
  prepared.forEach((p, unit) => {
    for (const s of p.segments) pieces.push({ unit, widthKw: s.widthKw, slope: s.slopeKgPerKwh });
  });
  pieces.sort((x, y) => x.slope - y.slope || x.unit - y.unit);
  let remainingKw = loadKw - loadsKw.reduce((s, x) => s + x, 0);
  let lambda: number | null = pieces.length > 0 ? pieces[0].slope : null;
  for (const piece of pieces) {
    if (remainingKw <= 0) break;
    const takeKw = Math.min(piece.widthKw, remainingKw);
    loadsKw[piece.unit] += takeKw;
    remainingKw -= takeKw;
    lambda = piece.slope;
  }
  return { loadsKw, lambda };
}

/** Load of one unit at incremental cost lambda: the lower and upper ends of its response (they differ on a step). */
function response(p: PreparedUnit, lambda: number, upper: boolean): number {
  if (p.smooth) {
    const kw = (lambda - p.b) / (2 * p.c);
    return kw < p.minKw ? p.minKw : kw > p.maxKw ? p.maxKw : kw;
  }
  let kw = p.minKw;
  for (const s of p.segments) {
    if (s.slopeKgPerKwh < lambda || (upper && s.slopeKgPerKwh === lambda)) kw += s.widthKw;
    else break;
  }
  return kw;
}

function marginalRange(p: PreparedUnit): [number, number] {
  if (p.smooth) return [p.b + 2 * p.c * p.minKw, p.b + 2 * p.c * p.maxKw];
  if (p.segments.length === 0) return [Infinity, -Infinity];
  return [p.segments[0].slopeKgPerKwh, p.segments[p.segments.length - 1].slopeKgPerKwh];
}

/** Equal incremental cost by bisection on lambda with clamping at the limits, then an exact residual share-out. */
function bisectLambda(prepared: PreparedUnit[], loadKw: number, relTol: number): { loadsKw: number[]; lambda: number | null } {
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of prepared) {
    const [m0, m1] = marginalRange(p);
    lo = Math.min(lo, m0);
    hi = Math.max(hi, m1);
  }
  if (!(hi >= lo)) return { loadsKw: prepared.map((p) => p.minKw), lambda: null };
  const pad = 1e-6 * (1 + Math.abs(lo) + Math.abs(hi));
  lo -= pad;
  hi += pad;
  const total = (lambda: number, upper: boolean): number => {
    let s = 0;
    for (const p of prepared) s += response(p, lambda, upper);
    return s;
  };
  let exact: number | null = null;
  for (let k = 0; k < MAX_BISECTIONS && hi - lo > relTol * Math.max(Math.abs(lo), Math.abs(hi), 1e-300); k++) {
    const mid = 0.5 * (lo + hi);
    if (total(mid, false) > loadKw) hi = mid;
    else if (total(mid, true) < loadKw) lo = mid;
    else {
      exact = mid;
      break;
    }
  }
  // Every unit may move between its response at `from` and at `to`; the remaining load is shared in proportion
  // to that room, which for an unclamped quadratic is the same as moving lambda (its response is linear there).
  const fromLambda = exact ?? lo;
  const toLambda = exact ?? hi;
  const base = prepared.map((p) => response(p, fromLambda, exact === null));
  const room = prepared.map((p, i) => response(p, toLambda, true) - base[i]);
  const baseKw = base.reduce((s, x) => s + x, 0);
  const roomKw = room.reduce((s, x) => s + x, 0);
  const share = roomKw > 0 ? Math.min(1, Math.max(0, (loadKw - baseKw) / roomKw)) : 0;
  const loadsKw = base.map((x, i) => Math.min(prepared[i].maxKw, Math.max(prepared[i].minKw, x + room[i] * share)));
  return { loadsKw, lambda: fromLambda + (toLambda - fromLambda) * share };
}

/** Dispatch of already prepared units; used by the enumeration to avoid re-checking units. */
export function dispatchPrepared(prepared: PreparedUnit[], loadKw: number, relTol = DEFAULT_LAMBDA_REL_TOL): DispatchResult {
  const failure = limitFailure(prepared, loadKw);
  if (failure) return failure;
  if (prepared.length === 0) return assemble(prepared, [], loadKw, null);
  const minKw = prepared.reduce((s, p) => s + p.minKw, 0);
  const maxKw = prepared.reduce((s, p) => s + p.maxKw, 0);
  const targetKw = Math.min(Math.max(loadKw, minKw), maxKw);
  if (prepared.length === 1) {
    return assemble(prepared, [targetKw], loadKw, marginalAt(prepared[0], targetKw));
  }
  const { loadsKw, lambda } = prepared.every((p) => !p.smooth)
    ? fillSegments(prepared, targetKw)
    : bisectLambda(prepared, targetKw, relTol);
  return assemble(prepared, loadsKw, loadKw, lambda);
}

/** Incremental fuel of one set at a load (the slope of the segment the load lies on). */
function marginalAt(p: PreparedUnit, loadKw: number): number | null {
  if (p.smooth) return p.b + 2 * p.c * loadKw;
  let kw = p.minKw;
  let slope: number | null = p.segments.length > 0 ? p.segments[0].slopeKgPerKwh : null;
  for (const s of p.segments) {
    if (kw >= loadKw) break;
    slope = s.slopeKgPerKwh;
    kw += s.widthKw;
  }
  return slope;
}

/**
 * Economic dispatch of a given set of running gensets: the split of `loadKw` that burns the least fuel with
 * every set between its minimum and maximum continuous load.
 *
 * Quadratic curves: equal incremental cost (lambda) found by bisection with clamping at the limits
 * (Wood & Wollenberg, Power Generation, Operation and Control, 2nd ed., §3.1 and Example 3A/3B; Saadat, Power
 * System Analysis, §7.3–7.4), to `lambdaRelTol` relative, then the last fraction of load is shared so the
 * split sums exactly to the load. Piecewise convex curves: segments above each set's minimum are filled in
 * ascending order of slope (merit order), which is exact for convex piecewise-linear curves.
 *
 * Cost: O(N·k·log(1/tol)) for N sets of k segments (about 35–60 bisection steps); O(S log S) for S segments when
 * all curves are piecewise.
 *
 * Throws on bad input (negative load, non-convex curve, curve not covering the operating range, duplicate
 * ids). A load outside the sum of minima..maxima is not an exception: it returns `{ feasible: false, reason }`.
 *
 * @example
 * dispatchLoad(units, 850).units.map((u) => u.loadKw) // ≈ [393.2, 334.6, 122.2] for Wood & Wollenberg Example 3A
 */
export function dispatchLoad(units: GensetUnit[], loadKw: number, options: DispatchOptions = {}): DispatchResult {
  checkLoad(loadKw, 'dispatchLoad');
  const relTol = options.lambdaRelTol ?? DEFAULT_LAMBDA_REL_TOL;
  if (!(relTol > 0)) throw new Error('dispatchLoad requires lambdaRelTol > 0');
  return dispatchPrepared(prepareUnits(units, 'dispatchLoad'), loadKw, relTol);
}

/** Equal split of prepared units; used by the enumeration. */
export function equalSplitPrepared(prepared: PreparedUnit[], loadKw: number): DispatchResult {
  const failure = limitFailure(prepared, loadKw);
  if (failure) return failure;
  const ratedKw = prepared.reduce((s, p) => s + p.unit.ratedKw, 0);
  if (prepared.length === 0) return assemble(prepared, [], loadKw, null);
  const pct = (loadKw / ratedKw) * 100;
  const tolPct = 1e-9 * 100;
  for (const p of prepared) {
    const label = p.unit.name || p.unit.id;
    const where =
      pct < p.unit.minLoadPct - tolPct
        ? `below ${label}'s ${formatNumber(p.unit.minLoadPct)} % minimum load`
        : pct > p.unit.maxLoadPct + tolPct
          ? `above ${label}'s ${formatNumber(p.unit.maxLoadPct)} % maximum continuous load`
          : null;
    if (where) {
      return {
        feasible: false,
        loadKw,
        rule: 'equal-split-limit',
        reason: `equal split at ${formatNumber(pct)} % of rating is ${where}`,
        minKw: prepared.reduce((s, q) => s + q.minKw, 0),
        maxKw: prepared.reduce((s, q) => s + q.maxKw, 0),
      };
    }
  }
  return assemble(prepared, prepared.map((p) => (p.unit.ratedKw * pct) / 100), loadKw, null);
}

/**
 * Equal load sharing: every running set at the same % of its rating (what isochronous or equal-droop load
 * sharing gives, common practice), with its fuel rate.
 *
 * Cost: O(N). Throws on bad input like `dispatchLoad`. When the common % falls outside any set's limits the
 * result is `{ feasible: false, rule: 'equal-split-limit', reason }`.
 *
 * @example equalSplit(threeEqualSets, 800).units.map((u) => u.loadKw) // [266.67, 266.67, 266.67]
 */
export function equalSplit(units: GensetUnit[], loadKw: number): DispatchResult {
  checkLoad(loadKw, 'equalSplit');
  return equalSplitPrepared(prepareUnits(units, 'equalSplit'), loadKw);
}
