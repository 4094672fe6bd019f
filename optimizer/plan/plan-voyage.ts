/**
 * Main voyage-plan solver: per-period enumeration with exact dispatch, DP over commitment states for
 * starts and minimum up/down times, Lagrange prices on running-hour budgets (subgradient), repair, and an
 * exact budget-tracking pass when the price gap stays open.
 */
import { buildDpGrid, relaxedCostToGo, relaxedSchedule, solveCommitmentDp, solveScheduleExact, type DpGrid } from './commitment-dp';
import { periodCommitments, type PeriodCommitments } from './period-options';
import { buildPlan, infeasiblePlan, scheduleTotals } from './plan-output';
import type { PlanOptions, PlanProblem, VoyagePlan } from './types';

/**
 * Throws on malformed input (not on infeasible plans).
 *
 * Cost: O(T + units). Throws messages naming the caller.
 *
 * @example validatePlanProblem(problem, 'planVoyage')
 */
export function validatePlanProblem(problem: PlanProblem, caller: string): void {
  if (!problem || !Array.isArray(problem.units) || problem.units.length === 0) throw new Error(`${caller} requires at least one unit`);
  if (!Array.isArray(problem.periods) || problem.periods.length === 0) throw new Error(`${caller} requires at least one period`);
  const ids = new Set<string>();
  for (const u of problem.units) {
    if (ids.has(u.id)) throw new Error(`${caller} requires unique unit ids (${u.id} repeats)`);
    ids.add(u.id);
    if (!(u.ratedKw > 0)) throw new Error(`${caller} requires a positive rating for ${u.id}`);
    if (!(u.startCostKg >= 0) || !(u.minUpH >= 0) || !(u.minDownH >= 0)) throw new Error(`${caller} requires non-negative start fuel and minimum up/down times for ${u.id}`);
  }
  problem.periods.forEach((p, t) => {
    if (!(p.durationH > 0)) throw new Error(`${caller} requires a positive duration in period ${t + 1}`);
    const loads = [p.loadKw, ...Object.values(p.sectionLoadsKw ?? {})];
    if (loads.some((x) => !(x >= 0) || !Number.isFinite(x))) throw new Error(`${caller} requires finite non-negative loads in period ${t + 1}`);
  });
  for (const [id, h] of Object.entries(problem.maxRunningHours ?? {})) {
    if (!ids.has(id)) throw new Error(`${caller}: running-hour budget for unknown unit ${id}`);
    if (!(h >= 0)) throw new Error(`${caller} requires non-negative running-hour budgets (${id})`);
  }
}

/** Infeasible periods of the per-period enumeration, or none. */
export function infeasiblePeriodsOf(commitments: PeriodCommitments[]): { index: number; reason: string }[] {
  const out: { index: number; reason: string }[] = [];
  commitments.forEach((c, index) => c.reason && out.push({ index, reason: c.reason }));
  return out;
}

/** DP grid of a problem (state encoding for starts and minimum up/down times). */
export function gridOf(problem: PlanProblem, commitments: PeriodCommitments[]): DpGrid {
  const units = problem.units;
  return buildDpGrid({
    n: units.length,
    durationH: problem.periods.map((p) => p.durationH),
    commitments,
    startCostKg: units.map((u) => u.startCostKg),
    minUpH: units.map((u) => u.minUpH),
    minDownH: units.map((u) => u.minDownH),
    initOn: units.map((u) => problem.initialState?.[u.id]?.on ?? false),
    initHoursInState: units.map((u) => problem.initialState?.[u.id]?.hoursInState ?? Infinity),
  });
}

function pricedCosts(grid: DpGrid, lambda: number[]): Float64Array[] {
  const n = grid.n;
  const lamOfMask = new Float64Array(1 << n);
  for (let m = 1; m < 1 << n; m++) {
    const low = 31 - Math.clz32(m & -m);
    lamOfMask[m] = lamOfMask[m & (m - 1)] + lambda[low];
  }
  return grid.commitments.map((c, t) => {
    const out = new Float64Array(c.masks.length);
    const d = grid.durationH[t];
    for (let j = 0; j < out.length; j++) out[j] = c.fuelKg[j] + d * lamOfMask[c.masks[j]];
    return out;
  });
}

/**
 * Plans which sets run in every period and how they share the load, at least total fuel (running fuel plus
 * start fuel), under the reserve rules, bus sections, minimum up/down times, initial state and running-hour
 * budgets. Lagrangian relaxation of the budgets with subgradient prices (Fisher, "The Lagrangian relaxation
 * method for solving integer programming problems", Management Science 27(1), 1981; Wood & Wollenberg,
 * 2nd ed., section 5.2.3) gives the lower bound; the plan states its gap and status.
 *
 * Cost: O(I · T · S · C) for I price iterations, S DP states and C commitments per period; the exact closing
 * pass is bounded by options.maxLabelsPerPeriod. Throws only on malformed input (see validatePlanProblem);
 * an infeasible plan is returned with reasons.
 *
 * @example planVoyage(problem).statusText // "optimal"
 */
export function planVoyage(problem: PlanProblem, options: PlanOptions = {}): VoyagePlan {
  validatePlanProblem(problem, 'planVoyage');
  let reported = 0;
  const progress = (f: number) => {
    reported = Math.max(reported, Math.min(1, f));
    options.onProgress?.(reported);
  };
  const optimalityGap = options.optimalityGap ?? 1e-6;
  const maxStates = options.maxStatesPerPeriod ?? 200_000;
  const maxIter = options.maxPriceIterations ?? 40;
  const units = problem.units;
  const n = units.length;
  progress(0);
  const commitments = periodCommitments(problem);
  const bad = infeasiblePeriodsOf(commitments);
  if (bad.length) {
    progress(1);
    return infeasiblePlan(problem, 'decomposition', bad, []);
  }
  progress(0.1);
  const grid = gridOf(problem, commitments);
  const horizonH = grid.startH[grid.T];
  // Budgets that can bind.
  const budgets = units.map((u) => {
    const b = problem.maxRunningHours?.[u.id];
    return b !== undefined && u.available && b < horizonH - 1e-9 ? b : Infinity;
  });
  const budgeted = budgets.map((b, i) => (Number.isFinite(b) ? i : -1)).filter((i) => i >= 0);
  // Valid bound when the DP is not exact: each period's cheapest commitment.
  const periodMin = commitments.map((c) => c.fuelKg.reduce((a, b) => Math.min(a, b), Infinity));
  const simpleBound = periodMin.reduce((a, b) => a + b, 0);

  const lambda = new Array<number>(n).fill(0);
  let bestLb = -Infinity;
  let bestLambda = lambda.slice();
  let bestUb = Infinity;
  let bestMasks: Int32Array | null = null;
  const budgetTerm = (lam: number[]) => budgeted.reduce((a, i) => a + lam[i] * budgets[i], 0);
  const overOf = (masks: Int32Array) => {
    const { hours } = scheduleTotals(problem, masks);
    return { hours, over: budgeted.map((i) => hours[i] - budgets[i]) };
  };
  /** Records a schedule with its cost under prices lam; returns the budget excess of each budgeted unit. */
  const candidate = (masks: Int32Array | null, pricedKg: number, lam: number[]): number[] | null => {
    if (!masks) return null;
    const { hours, over } = overOf(masks);
    if (over.every((g) => g <= 1e-9)) {
      const trueKg = pricedKg - budgeted.reduce((a, i) => a + lam[i] * hours[i], 0);
      if (trueKg < bestUb - 1e-9 * Math.abs(trueKg)) {
        bestUb = trueKg;
        bestMasks = masks;
      }
    }
    return over;
  };
  const raiseLb = (lb: number, lam: number[]) => {
    if (lb > bestLb) {
      bestLb = lb;
      bestLambda = lam.slice();
    }
  };
  const closedGap = () => Number.isFinite(bestUb) && bestUb - bestLb <= optimalityGap * Math.abs(bestUb);

  // Prices zero: the exact schedule without budgets.
  const first = solveScheduleExact(grid, pricedCosts(grid, lambda), maxStates);
  if (!first.masks) {
    progress(1);
    return infeasiblePlan(problem, 'decomposition', [], ['no schedule meets the minimum up/down times from the initial state']);
  }
  let allExact = first.exact;
  raiseLb(first.exact ? first.costKg : first.relaxedBoundKg, lambda);
  const firstOver = candidate(first.masks, first.costKg, lambda)!;
  progress(0.2);
  if (budgeted.length && !closedGap()) {
    // Subgradient on the hourly prices, each round on the relaxed DP (bound) plus a greedy rollout (plans).
    const scale = Math.max(1e-6, simpleBound / Math.max(1, horizonH * n));
    let theta = 1;
    let sinceImprove = 0;
    let g = firstOver;
    let dual = bestLb;
    for (let it = 0; it < maxIter && !closedGap(); it++) {
      const target = Number.isFinite(bestUb) ? bestUb : bestLb + 0.02 * Math.abs(bestLb) + scale;
      const norm2 = g.reduce((a, x) => a + x * x, 0);
      if (norm2 < 1e-12) break;
      const step = (theta * Math.max(target - dual, 1e-6 * Math.abs(target))) / norm2;
      budgeted.forEach((i, q) => (lambda[i] = Math.max(0, lambda[i] + step * g[q])));
      const costs = pricedCosts(grid, lambda);
      const toGoKg = relaxedCostToGo(grid, costs);
      dual = toGoKg[0][grid.initMask] - budgetTerm(lambda);
      const before = bestLb;
      raiseLb(dual, lambda);
      g = overOf(relaxedSchedule(grid, costs, toGoKg)).over;
      const roll = solveCommitmentDp(grid, costs, { maxStates: 1, bounds: { upperBoundKg: Infinity, toGoKg } });
      candidate(roll.masks, roll.costKg, lambda);
      if (bestLb > before + 1e-9 * Math.abs(before)) sinceImprove = 0;
      else if (++sinceImprove >= 3) {
        theta /= 2;
        sinceImprove = 0;
      }
      progress(0.2 + (0.4 * (it + 1)) / maxIter);
    }
    // Exact DP at the best prices: a tighter bound and usually the plan.
    const atBest = solveScheduleExact(grid, pricedCosts(grid, bestLambda), maxStates);
    allExact &&= atBest.exact;
    if (atBest.masks) {
      raiseLb((atBest.exact ? atBest.costKg : atBest.relaxedBoundKg) - budgetTerm(bestLambda), bestLambda);
      candidate(atBest.masks, atBest.costKg, bestLambda);
    }
    // Repair by prices: raise the prices of sets over budget until a greedy rollout fits.
    const rep = bestLambda.slice();
    for (let round = 0; round < 30 && !Number.isFinite(bestUb); round++) {
      const costs = pricedCosts(grid, rep);
      const res = solveCommitmentDp(grid, costs, { maxStates: 1, bounds: { upperBoundKg: Infinity, toGoKg: relaxedCostToGo(grid, costs) } });
      const over = candidate(res.masks, res.costKg, rep);
      if (!over) break;
      budgeted.forEach((i, q) => {
        if (over[q] > 1e-9) rep[i] = rep[i] * 1.5 + scale;
      });
    }
    progress(0.6);
    if (!closedGap()) {
      // Repair: a narrow beam that carries the running hours (never over budget), ranked by cost plus the
      // priced cost to go; then the exact pass with the same labels, pruned by the best plan.
      const toGoKg = relaxedCostToGo(grid, pricedCosts(grid, bestLambda));
      const trueCosts = pricedCosts(grid, new Array<number>(n).fill(0));
      const tracking = {
        units: budgeted,
        budgetsH: budgeted.map((i) => budgets[i]),
        lambdaKgPerH: budgeted.map((i) => bestLambda[i]),
        maxLabelsPerPeriod: options.maxLabelsPerPeriod ?? 40_000,
        maxWork: options.maxLabelWork ?? 4e6,
      };
      const transitionsPerState = commitments.reduce((a, c) => a + c.masks.length, 0);
      const small = transitionsPerState <= (options.exactPassMaxTransitions ?? 8_000);
      for (const width of [32, 256, 2048]) {
        if (closedGap() || (Number.isFinite(bestUb) && (!small || width * transitionsPerState > tracking.maxWork))) break;
        const beam = solveCommitmentDp(grid, trueCosts, { maxStates: width, bounds: { upperBoundKg: bestUb, toGoKg }, tracking });
        if (beam.masks) candidate(beam.masks, beam.costKg, new Array<number>(n).fill(0));
      }
      progress(0.75);
      const exactRes = !small
        ? { masks: null, costKg: Infinity, exact: false, aborted: true }
        : solveCommitmentDp(grid, trueCosts, { maxStates: Number.MAX_SAFE_INTEGER, bounds: { upperBoundKg: bestUb, toGoKg }, tracking });
      if (!exactRes.aborted) {
        if (exactRes.masks && exactRes.costKg < bestUb) {
          bestMasks = exactRes.masks;
          bestUb = exactRes.costKg;
        }
        if (bestMasks) {
          bestLb = bestUb;
          allExact = true;
        } else {
          progress(1);
          return infeasiblePlan(problem, 'decomposition', [], ['the running-hour budgets cannot cover the periods that need sets']);
        }
      }
    }
  }
  progress(1);
  if (!bestMasks) return infeasiblePlan(problem, 'decomposition', [], ['no schedule within the running-hour budgets was found']);
  const lb = allExact ? Math.max(bestLb, simpleBound) : Math.max(simpleBound, first.relaxedBoundKg);
  return buildPlan(problem, bestMasks, 'decomposition', lb, optimalityGap);
}
