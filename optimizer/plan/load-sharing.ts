/**
 * Exact load sharing between running sets with convex fuel curves (equal incremental cost).
 *
 * Every unit becomes a cost model on [minKw, maxKw]: a quadratic with c > 0, or a fuel value at minKw plus
 * linear segments with non-decreasing slopes (piecewise curves clipped to the unit's range, linear
 * quadratics as one segment).
 */
import { chordCurve, maxLoadKw, minLoadKw, type FuelCurve, type GensetUnit } from '../plant';

export interface UnitCostModel {
  minKw: number;
  maxKw: number;
  /** 'quadratic': a + b·P + c·P², c > 0. 'segments': fuelAtMinKgPerH + Σ slope·(filled width). */
  kind: 'quadratic' | 'segments';
  a: number;
  b: number;
  c: number;
  fuelAtMinKgPerH: number;
  widthsKw: number[];
  slopesKgPerKwh: number[];
}

/**
 * Builds the cost model of a unit on its load range [minLoadKw, maxLoadKw].
 *
 * Cost: O(k) for a curve with k breakpoints. Throws when the curve is not convex or a piecewise curve
 * does not cover the unit's load range.
 *
 * @example unitCostModel(unit).kind // 'quadratic'
 */
export function unitCostModel(unit: GensetUnit): UnitCostModel {
  const minKw = minLoadKw(unit);
  const maxKw = maxLoadKw(unit);
  if (!(maxKw >= minKw) || !(minKw >= 0)) throw new Error(`unitCostModel requires 0 ≤ min load ≤ max load for ${unit.id}`);
  const curve: FuelCurve = unit.curve;
  const base = { minKw, maxKw, a: 0, b: 0, c: 0, fuelAtMinKgPerH: 0, widthsKw: [] as number[], slopesKgPerKwh: [] as number[] };
  if (curve.kind === 'quadratic') {
    if (curve.c < 0) throw new Error(`unitCostModel requires a convex fuel curve (c ≥ 0) for ${unit.id}`);
    if (curve.c > 0) return { ...base, kind: 'quadratic', a: curve.a, b: curve.b, c: curve.c, fuelAtMinKgPerH: curve.a + curve.b * minKw + curve.c * minKw * minKw };
    const fuelAtMin = curve.a + curve.b * minKw;
    return maxKw > minKw
      ? { ...base, kind: 'segments', fuelAtMinKgPerH: fuelAtMin, widthsKw: [maxKw - minKw], slopesKgPerKwh: [curve.b] }
      : { ...base, kind: 'segments', fuelAtMinKgPerH: fuelAtMin };
  }
  const xs = curve.breakpointsKw;
  const ys = curve.fuelKgPerH;
  const tol = 1e-9 * Math.max(1, maxKw);
  if (xs.length < 2 || xs.length !== ys.length) throw new Error(`unitCostModel requires at least 2 matching breakpoints for ${unit.id}`);
  if (xs[0] > minKw + tol || xs[xs.length - 1] < maxKw - tol) {
    throw new Error(`unitCostModel: the curve of ${unit.id} does not cover its load range ${minKw} to ${maxKw} kW`);
  }
  const widthsKw: number[] = [];
  const slopes: number[] = [];
  let fuelAtMin = NaN;
  for (let k = 0; k + 1 < xs.length; k++) {
    if (!(xs[k + 1] > xs[k])) throw new Error(`unitCostModel requires strictly increasing breakpoints for ${unit.id}`);
    const slope = (ys[k + 1] - ys[k]) / (xs[k + 1] - xs[k]);
    if (slopes.length > 0 && slope < slopes[slopes.length - 1] - 1e-12) throw new Error(`unitCostModel requires a convex fuel curve for ${unit.id}`);
    const lo = Math.max(xs[k], minKw);
    const hi = Math.min(xs[k + 1], maxKw);
    if (Number.isNaN(fuelAtMin) && xs[k] <= minKw + tol && minKw <= xs[k + 1] + tol) fuelAtMin = ys[k] + slope * (minKw - xs[k]);
    if (hi > lo + tol) {
      widthsKw.push(hi - lo);
      slopes.push(slope);
    } else if (slopes.length > 0 && xs[k] < maxKw) slopes[slopes.length - 1] = Math.max(slopes[slopes.length - 1], slope);
  }
  return { ...base, kind: 'segments', fuelAtMinKgPerH: fuelAtMin, widthsKw, slopesKgPerKwh: slopes };
}

/**
 * Fuel rate of a cost model at a load inside its range, kg/h.
 *
 * Cost: O(segments). Does not throw; loads are clamped to [minKw, maxKw].
 *
 * @example modelFuelKgPerH(model, model.minKw) === model.fuelAtMinKgPerH
 */
export function modelFuelKgPerH(model: UnitCostModel, loadKw: number): number {
  const p = Math.min(model.maxKw, Math.max(model.minKw, loadKw));
  if (model.kind === 'quadratic') return model.a + model.b * p + model.c * p * p;
  let rest = p - model.minKw;
  let fuel = model.fuelAtMinKgPerH;
  for (let k = 0; k < model.widthsKw.length && rest > 0; k++) {
    const w = Math.min(rest, model.widthsKw[k]);
    fuel += w * model.slopesKgPerKwh[k];
    rest -= w;
  }
  return fuel;
}

export interface LoadShare {
  /** Load of each model, in the order given, kW. */
  loadsKw: number[];
  fuelKgPerH: number;
  /** Incremental cost at the optimum, kg/kWh. */
  lambdaKgPerKwh: number;
}

function quadLoad(m: UnitCostModel, lambda: number): number {
  return Math.min(m.maxKw, Math.max(m.minKw, (lambda - m.b) / (2 * m.c)));
}

/** Total output at price lambda: `strict` counts only segments with slope < lambda, else slope ≤ lambda. */
function totalAt(models: UnitCostModel[], lambda: number, strict: boolean): number {
  let total = 0;
  for (const m of models) {
    if (m.kind === 'quadratic') total += quadLoad(m, lambda);
    else {
      total += m.minKw;
      for (let k = 0; k < m.widthsKw.length; k++) {
        const s = m.slopesKgPerKwh[k];
        if (s < lambda || (!strict && s === lambda)) total += m.widthsKw[k];
      }
    }
  }
  return total;
}

/**
 * Splits a load between running units at least fuel: every unit between its limits at one incremental cost λ
 * (Karush–Kuhn–Tucker conditions of economic dispatch; Wood & Wollenberg, Power Generation, Operation and
 * Control, 2nd ed., section 3.1). Exact: λ is found among the kinks of the total output curve, then by a
 * linear solve between kinks; segments with slope exactly λ take the remainder.
 *
 * Cost: O(K log K + n·K·log K) for K kinks. Returns null when the load lies outside [Σ min, Σ max]
 * (infeasible, not an error); does not throw.
 *
 * @example shareLoad([m1, m2], 1500).loadsKw // [750, 750] for two identical sets
 */
export function shareLoad(models: UnitCostModel[], loadKw: number): LoadShare | null {
  let sumMin = 0;
  let sumMax = 0;
  for (const m of models) {
    sumMin += m.minKw;
    sumMax += m.maxKw;
  }
  const tol = 1e-9 * Math.max(1, sumMax);
  if (loadKw < sumMin - tol || loadKw > sumMax + tol) return null;
  const L = Math.min(sumMax, Math.max(sumMin, loadKw));
  const kinks: number[] = [];
  for (const m of models) {
    if (m.kind === 'quadratic') kinks.push(m.b + 2 * m.c * m.minKw, m.b + 2 * m.c * m.maxKw);
    else kinks.push(...m.slopesKgPerKwh);
  }
  kinks.sort((x, y) => x - y);
  const loadsKw = new Array<number>(models.length);
  if (kinks.length === 0) {
    models.forEach((m, i) => (loadsKw[i] = m.minKw));
    return finish(models, loadsKw, 0);
  }
  // Smallest kink with total(≤) ≥ L.
  let lo = 0;
  let hi = kinks.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (totalAt(models, kinks[mid], false) >= L - tol) hi = mid;
    else lo = mid + 1;
  }
  const kink = kinks[lo];
  const below = totalAt(models, kink, true);
  let lambda = kink;
  if (below > L + tol && lo > 0) {
    // Between kinks[lo-1] and kink only quadratics move: Σ (λ − b)/(2c) over interior units = rest.
    const prev = kinks[lo - 1];
    const mid = (prev + kink) / 2;
    let fixed = 0;
    let sumInv = 0;
    let sumB = 0;
    for (const m of models) {
      if (m.kind === 'quadratic') {
        const pm = (mid - m.b) / (2 * m.c);
        if (pm <= m.minKw) fixed += m.minKw;
        else if (pm >= m.maxKw) fixed += m.maxKw;
        else {
          sumInv += 1 / (2 * m.c);
          sumB += m.b / (2 * m.c);
        }
      } else {
        fixed += m.minKw;
        for (let k = 0; k < m.widthsKw.length; k++) if (m.slopesKgPerKwh[k] <= prev) fixed += m.widthsKw[k];
      }
    }
    lambda = sumInv > 0 ? (L - fixed + sumB) / sumInv : mid;
    lambda = Math.min(kink, Math.max(prev, lambda));
  }
  let rest = L;
  models.forEach((m, i) => {
    if (m.kind === 'quadratic') loadsKw[i] = quadLoad(m, lambda);
    else {
      let p = m.minKw;
      for (let k = 0; k < m.widthsKw.length; k++) if (m.slopesKgPerKwh[k] < lambda) p += m.widthsKw[k];
      loadsKw[i] = p;
    }
    rest -= loadsKw[i];
  });
  // Segments priced exactly at λ take what is left.
  for (let i = 0; i < models.length && rest > 0; i++) {
    const m = models[i];
    if (m.kind !== 'segments') continue;
    for (let k = 0; k < m.widthsKw.length && rest > 0; k++) {
      if (m.slopesKgPerKwh[k] !== lambda) continue;
      const take = Math.min(rest, m.widthsKw[k]);
      loadsKw[i] += take;
      rest -= take;
    }
  }
  return finish(models, loadsKw, lambda);
}

function finish(models: UnitCostModel[], loadsKw: number[], lambda: number): LoadShare {
  let fuel = 0;
  models.forEach((m, i) => (fuel += modelFuelKgPerH(m, loadsKw[i])));
  return { loadsKw, fuelKgPerH: fuel, lambdaKgPerKwh: lambda };
}

/**
 * The same units with their quadratic curves replaced by `segments` equal chords between their minimum
 * and maximum loads (the piecewise-linear model the MILP uses). Piecewise curves are kept.
 *
 * Cost: O(units·segments). Throws when segments is not a whole number ≥ 1.
 *
 * @example withChordCurves(units, 5)[0].curve.kind // 'piecewise'
 */
export function withChordCurves(units: GensetUnit[], segments: number): GensetUnit[] {
  return units.map((u) => {
    if (u.curve.kind !== 'quadratic') return u;
    const lo = minLoadKw(u);
    const hi = maxLoadKw(u);
    const curve = hi > lo ? chordCurve(u.curve, lo, hi, segments) : chordCurve(u.curve, lo, lo + 1, 1);
    return { ...u, curve };
  });
}
