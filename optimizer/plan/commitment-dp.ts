/**
 * Dynamic programming over commitment states (forward recursion of unit commitment; Wood & Wollenberg,
 * Power Generation, Operation and Control, 2nd ed., section 5.2.2).
 *
 * A state is the commitment mask plus, per unit, a "lock code": 0 when the unit may change state in the next
 * period, 1 when it is still held by its initial state, 2 + k when it switched k periods before the current
 * one and is still held by its minimum up or down time. Codes are packed with the mask into one number.
 * Optional label mode also carries the running hours of budgeted units (resource-constrained shortest path
 * with Pareto dominance), used to close the gap left by the Lagrange prices exactly on small plans.
 */
import type { PeriodCommitments } from './period-options';

const EPS_H = 1e-9;

export interface DpGrid {
  n: number;
  T: number;
  /** Period boundaries, h; length T + 1. */
  startH: Float64Array;
  durationH: Float64Array;
  commitments: PeriodCommitments[];
  startCostKg: Float64Array;
  minUpH: Float64Array;
  minDownH: Float64Array;
  initMask: number;
  /** Time of the last switch before the plan, h (negative; −Infinity when free). */
  initSwitchH: Float64Array;
  radix: number[];
  weight: number[];
  /** Start fuel of the units in a mask, kg, for every mask. */
  startCostOfMask: Float64Array;
  /** Mask of units held (not free) by the initial state before period 0, with their codes packed. */
  initPacked: number;
}

export interface DpGridInput {
  n: number;
  durationH: number[];
  commitments: PeriodCommitments[];
  startCostKg: number[];
  minUpH: number[];
  minDownH: number[];
  initOn: boolean[];
  initHoursInState: number[];
}

/**
 * Prepares the state encoding of the DP for one plan.
 *
 * Cost: O(n·T·w) for lock windows of w periods. Throws when the packed state would not fit in a double's
 * exact integer range (minimum up/down times very long compared with the periods).
 *
 * @example const grid = buildDpGrid({ n: 2, durationH: [1, 1], ... })
 */
export function buildDpGrid(input: DpGridInput): DpGrid {
  const { n } = input;
  const T = input.durationH.length;
  const startH = new Float64Array(T + 1);
  for (let t = 0; t < T; t++) startH[t + 1] = startH[t] + input.durationH[t];
  const radix: number[] = [];
  const weight: number[] = [];
  let w = 1;
  const initSwitchH = new Float64Array(n);
  let initMask = 0;
  let initPacked = 0;
  for (let i = 0; i < n; i++) {
    const req = Math.max(input.minUpH[i], input.minDownH[i]);
    let maxK = -1;
    for (let tau = 0; tau < T; tau++) {
      let t = tau;
      while (t < T && startH[t + 1] - startH[tau] < req - EPS_H) t++;
      maxK = Math.max(maxK, t - tau - 1);
    }
    radix.push(3 + Math.max(maxK, -1));
    weight.push(w);
    w *= radix[i];
    const on = input.initOn[i];
    if (on) initMask |= 1 << i;
    const held = input.initHoursInState[i] < (on ? input.minUpH[i] : input.minDownH[i]) - EPS_H;
    initSwitchH[i] = held ? -input.initHoursInState[i] : -Infinity;
    if (held) initPacked += weight[i];
  }
  if (w * 2 ** n > Number.MAX_SAFE_INTEGER) throw new Error('buildDpGrid: minimum up/down times are too long for the period grid');
  const startCostOfMask = new Float64Array(1 << n);
  for (let m = 1; m < 1 << n; m++) {
    const low = 31 - Math.clz32(m & -m);
    startCostOfMask[m] = startCostOfMask[m & (m - 1)] + input.startCostKg[low];
  }
  return {
    n,
    T,
    startH,
    durationH: Float64Array.from(input.durationH),
    commitments: input.commitments,
    startCostKg: Float64Array.from(input.startCostKg),
    minUpH: Float64Array.from(input.minUpH),
    minDownH: Float64Array.from(input.minDownH),
    initMask,
    initSwitchH,
    radix,
    weight,
    startCostOfMask,
    initPacked,
  };
}

export interface DpTracking {
  /** Unit indices whose running hours are carried in the labels. */
  units: number[];
  budgetsH: number[];
  /** Prices of the tracked units the bound to go was computed with, kg/h (0 when it was not priced). */
  lambdaKgPerH: number[];
  maxLabelsPerPeriod: number;
  /** Most label extensions in total before the search gives up. */
  maxWork: number;
}

export interface DpBounds {
  /** Any schedule costing more than this is dropped. */
  upperBoundKg: number;
  /**
   * toGoKg[t][mask]: a lower bound on the cost of periods t..T−1 when the commitment before period t is
   * mask (length T + 1). With tracking it is corrected by −Σ λ·(budget − hours used).
   */
  toGoKg: Float64Array[];
}

export interface DpResult {
  /** Commitment mask per period; null when no schedule exists. */
  masks: Int32Array | null;
  /** Objective of the returned schedule under the given period costs, kg. */
  costKg: number;
  /** false when states were cut (beam) so the optimum over all schedules is not guaranteed. */
  exact: boolean;
  /** Label mode only: true when the label limit was exceeded and the search gave up. */
  aborted: boolean;
}

/**
 * Least-cost schedule over the grid for given period costs (costKg[t][j] for commitment j of period t),
 * honouring start fuel, minimum up and down times and the initial state.
 *
 * Cost: O(T · S · C) for S states and C commitments per period. Does not throw; no schedule → masks null.
 *
 * @example solveCommitmentDp(grid, costs, { maxStates: 1e5 }).masks
 */
export function solveCommitmentDp(
  grid: DpGrid,
  costKg: Float64Array[],
  opts: { maxStates: number; tracking?: DpTracking; bounds?: DpBounds },
): DpResult {
  const { n, T, startH, radix, weight } = grid;
  const maskBits = (1 << n) - 1;
  const base = 2 ** n;
  const track = opts.tracking;
  const k = track ? track.units.length : 0;
  // Current layer.
  let keys: number[] = [base * grid.initPacked + grid.initMask];
  let costs: number[] = [0];
  let hours: number[] = new Array(k).fill(0);
  const backs: Int32Array[] = [];
  const layerMasks: Int32Array[] = [];
  let exact = true;
  const codes = new Int32Array(n);
  const adv = new Int32Array(n);
  const swOn = new Int32Array(n);
  const swOff = new Int32Array(n);
  const trackBit = new Int32Array(n).fill(-1);
  if (track) track.units.forEach((u, j) => (trackBit[u] = j));
  const hv = new Float64Array(k);
  const bounds = opts.bounds;
  let work = 0;
  const ub = bounds ? bounds.upperBoundKg * (1 + 1e-9) + 1e-9 : Infinity;
  for (let t = 0; t < T; t++) {
    const { masks, } = grid.commitments[t];
    const c = costKg[t];
    const tEnd = startH[t + 1];
    const toGo = bounds ? bounds.toGoKg[t + 1] : null;
    for (let i = 0; i < n; i++) {
      swOn[i] = tEnd - startH[t] >= grid.minUpH[i] - EPS_H ? 0 : 2;
      swOff[i] = tEnd - startH[t] >= grid.minDownH[i] - EPS_H ? 0 : 2;
    }
    const index = new Map<number, number>();
    const listIndex = track ? new Map<number, number[]>() : null;
    const nKeys: number[] = [];
    const nCosts: number[] = [];
    const nBack: number[] = [];
    const nMask: number[] = [];
    const nHours: number[] = [];
    const dead: boolean[] = [];
    for (let s = 0; s < keys.length; s++) {
      const key = keys[s];
      const mask = key % base;
      let packed = Math.floor(key / base);
      let locked = 0;
      let advPacked = 0;
      for (let i = 0; i < n; i++) {
        const code = packed % radix[i];
        packed = Math.floor(packed / radix[i]);
        codes[i] = code;
        if (code === 0) {
          adv[i] = 0;
          continue;
        }
        locked |= 1 << i;
        const on = (mask >> i) & 1;
        const req = on ? grid.minUpH[i] : grid.minDownH[i];
        const since = code === 1 ? grid.initSwitchH[i] : startH[t - 1 - (code - 2)];
        const next = tEnd - since >= req - EPS_H ? 0 : code === 1 ? 1 : code + 1;
        adv[i] = next;
        advPacked += next * weight[i];
      }
      const baseCost = costs[s];
      for (let j = 0; j < masks.length; j++) {
        const m = masks[j];
        const changed = (m ^ mask) & maskBits;
        if (changed & locked) continue;
        let newPacked = advPacked;
        let bits = changed;
        while (bits) {
          const i = 31 - Math.clz32(bits & -bits);
          bits &= bits - 1;
          newPacked += ((m >> i) & 1 ? swOn[i] : swOff[i]) * weight[i];
        }
        const newKey = base * newPacked + m;
        const cost = baseCost + c[j] + grid.startCostOfMask[m & ~mask];
        if (toGo && !track && cost + toGo[m] > ub) continue;
        if (!track) {
          const at = index.get(newKey);
          if (at === undefined) {
            index.set(newKey, nKeys.length);
            nKeys.push(newKey);
            nCosts.push(cost);
            nBack.push(s);
            nMask.push(m);
          } else if (cost < nCosts[at]) {
            nCosts[at] = cost;
            nBack[at] = s;
          }
          continue;
        }
        // Label mode: running hours of tracked units, budget and bound pruning, Pareto dominance.
        if (++work > track.maxWork) return { masks: null, costKg: Infinity, exact: false, aborted: true };
        let over = false;
        for (let q = 0; q < k; q++) {
          hv[q] = hours[s * k + q] + ((m >> track.units[q]) & 1 ? grid.durationH[t] : 0);
          if (hv[q] > track.budgetsH[q] + 1e-9) over = true;
        }
        if (over) continue;
        if (toGo) {
          let slack = 0;
          for (let q = 0; q < k; q++) slack += track.lambdaKgPerH[q] * (track.budgetsH[q] - hv[q]);
          if (cost + toGo[m] - slack > ub) continue;
        }
        let list = listIndex!.get(newKey);
        if (!list) listIndex!.set(newKey, (list = []));
        let dominated = false;
        for (const l of list) {
          if (dead[l]) continue;
          let lBetter = nCosts[l] <= cost + 1e-9;
          let newBetter = cost <= nCosts[l] + 1e-9;
          for (let q = 0; q < k && (lBetter || newBetter); q++) {
            const a = nHours[l * k + q];
            if (a > hv[q] + 1e-9) lBetter = false;
            if (hv[q] > a + 1e-9) newBetter = false;
          }
          if (lBetter) {
            dominated = true;
            break;
          }
          if (newBetter) dead[l] = true;
        }
        if (dominated) continue;
        list.push(nKeys.length);
        nKeys.push(newKey);
        nCosts.push(cost);
        nBack.push(s);
        nMask.push(m);
        dead.push(false);
        for (let q = 0; q < k; q++) nHours.push(hv[q]);
        if (nKeys.length > track.maxLabelsPerPeriod) return { masks: null, costKg: Infinity, exact: false, aborted: true };
      }
    }
    // Compact: drop dead labels and, without tracking, states dominated by a cheaper state of the same
    // mask whose every unit is at least as free (exact pruning).
    let order = nKeys.map((_, i) => i).filter((i) => !dead[i]);
    if (!track) order = paretoStates(order, nKeys, nCosts, base, radix);
    if (order.length > opts.maxStates) {
      const rank = (i: number) => nCosts[i] + (toGo ? toGo[nMask[i]] : 0);
      order.sort((a, b) => rank(a) - rank(b));
      order = order.slice(0, opts.maxStates);
      exact = false;
    }
    if (order.length === 0) return { masks: null, costKg: Infinity, exact, aborted: false };
    keys = order.map((i) => nKeys[i]);
    costs = order.map((i) => nCosts[i]);
    backs.push(Int32Array.from(order, (i) => nBack[i]));
    layerMasks.push(Int32Array.from(order, (i) => nMask[i]));
    if (track) {
      const h: number[] = [];
      for (const i of order) for (let q = 0; q < k; q++) h.push(nHours[i * k + q]);
      hours = h;
    }
  }
  let best = 0;
  for (let s = 1; s < costs.length; s++) if (costs[s] < costs[best]) best = s;
  const out = new Int32Array(T);
  let s = best;
  for (let t = T - 1; t >= 0; t--) {
    out[t] = layerMasks[t][s];
    s = backs[t][s];
  }
  return { masks: out, costKg: T === 0 ? 0 : costs[best], exact, aborted: false };
}

/** Freeness rank of a lock code: free is freest, then the initial hold, then older switches. */
function freeness(code: number, radix: number): number {
  return code === 0 ? radix + 1 : code === 1 ? radix : code;
}

function paretoStates(order: number[], keys: number[], costs: number[], base: number, radix: number[]): number[] {
  const n = radix.length;
  const byMask = new Map<number, number[]>();
  for (const i of order) {
    const m = keys[i] % base;
    let g = byMask.get(m);
    if (!g) byMask.set(m, (g = []));
    g.push(i);
  }
  const out: number[] = [];
  const ranks: Int32Array[] = [];
  for (const g of byMask.values()) {
    if (g.length === 1) {
      out.push(g[0]);
      continue;
    }
    g.sort((a, b) => costs[a] - costs[b]);
    ranks.length = 0;
    for (const i of g) {
      const r = new Int32Array(n);
      let packed = Math.floor(keys[i] / base);
      for (let u = 0; u < n; u++) {
        r[u] = freeness(packed % radix[u], radix[u]);
        packed = Math.floor(packed / radix[u]);
      }
      let dominated = false;
      for (const kept of ranks) {
        let all = true;
        for (let u = 0; u < n && all; u++) if (kept[u] < r[u]) all = false;
        if (all) {
          dominated = true;
          break;
        }
      }
      if (dominated) continue;
      ranks.push(r);
      out.push(i);
    }
  }
  return out;
}

/**
 * Backward DP over commitment masks alone (start fuel counted, minimum up/down times ignored): a lower bound
 * on the cost to go from every mask, used to prune the exact DP. toGo[t][mask] for t = 0..T.
 *
 * Cost: O(Σ_t C_{t−1}·C_t) time, O(T·2^n) memory. Does not throw.
 *
 * @example relaxedCostToGo(grid, costs)[0][grid.initMask] // lower bound on the whole plan
 */
export function relaxedCostToGo(grid: DpGrid, costKg: Float64Array[]): Float64Array[] {
  const size = 1 << grid.n;
  const out: Float64Array[] = new Array(grid.T + 1);
  out[grid.T] = new Float64Array(size);
  for (let t = grid.T - 1; t >= 0; t--) {
    const next = out[t + 1];
    const cur = new Float64Array(size).fill(Infinity);
    const { masks } = grid.commitments[t];
    const c = costKg[t];
    const prevMasks = t === 0 ? [grid.initMask] : grid.commitments[t - 1].masks;
    for (const pm of prevMasks) {
      let best = Infinity;
      for (let j = 0; j < masks.length; j++) {
        const v = c[j] + grid.startCostOfMask[masks[j] & ~pm] + next[masks[j]];
        if (v < best) best = v;
      }
      cur[pm] = best;
    }
    out[t] = cur;
  }
  return out;
}

/**
 * Exact least-cost schedule for given period costs: a bound from relaxedCostToGo, a feasible schedule from a
 * greedy rollout (or a narrow beam), then the exact DP pruned by both (skipped when the beam already meets the bound).
 *
 * Cost: as solveCommitmentDp, usually far fewer states. Does not throw.
 *
 * @example solveScheduleExact(grid, costs, 2e5).costKg
 */
export function solveScheduleExact(grid: DpGrid, costKg: Float64Array[], maxStates: number): DpResult & { relaxedBoundKg: number } {
  const toGoKg = relaxedCostToGo(grid, costKg);
  const relaxedBoundKg = toGoKg[0][grid.initMask];
  // Greedy rollout along the relaxed cost to go (one state per period); a wider beam if it dead-ends.
  let beam = solveCommitmentDp(grid, costKg, { maxStates: 1, bounds: { upperBoundKg: Infinity, toGoKg } });
  if (!beam.masks) beam = solveCommitmentDp(grid, costKg, { maxStates: 24, bounds: { upperBoundKg: Infinity, toGoKg } });
  if (!beam.masks) {
    const full = solveCommitmentDp(grid, costKg, { maxStates, bounds: { upperBoundKg: Infinity, toGoKg } });
    return { ...full, relaxedBoundKg };
  }
  const closed = (r: DpResult) => r.costKg <= relaxedBoundKg + 1e-9 * Math.abs(relaxedBoundKg);
  if (closed(beam)) return { ...beam, exact: true, relaxedBoundKg };
  const wider = solveCommitmentDp(grid, costKg, { maxStates: 16, bounds: { upperBoundKg: beam.costKg, toGoKg } });
  if (wider.masks && wider.costKg < beam.costKg) beam = wider;
  if (closed(beam)) return { ...beam, exact: true, relaxedBoundKg };
  const full = solveCommitmentDp(grid, costKg, { maxStates, bounds: { upperBoundKg: beam.costKg, toGoKg } });
  return full.masks ? { ...full, relaxedBoundKg } : { ...beam, exact: full.exact, relaxedBoundKg };
}

/**
 * The schedule that attains the relaxed cost to go (minimum up/down times ignored): a subgradient source for
 * the Lagrange prices. Not necessarily feasible.
 *
 * Cost: O(Σ_t C_t). Does not throw.
 *
 * @example relaxedSchedule(grid, costs, relaxedCostToGo(grid, costs))
 */
export function relaxedSchedule(grid: DpGrid, costKg: Float64Array[], toGoKg: Float64Array[]): Int32Array {
  const out = new Int32Array(grid.T);
  let prev = grid.initMask;
  for (let t = 0; t < grid.T; t++) {
    const { masks } = grid.commitments[t];
    const next = toGoKg[t + 1];
    let best = Infinity;
    let arg = masks[0];
    for (let j = 0; j < masks.length; j++) {
      const v = costKg[t][j] + grid.startCostOfMask[masks[j] & ~prev] + next[masks[j]];
      if (v < best) {
        best = v;
        arg = masks[j];
      }
    }
    out[t] = prev = arg;
  }
  return out;
}
