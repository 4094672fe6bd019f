/**
 * Baseline for the "saving against baseline" figure: the load-dependent start/stop logic of a power
 * management system with equal load sharing, run period by period without look-ahead.
 */
import { unitCostModel, modelFuelKgPerH } from './load-sharing';
import { loadGroups, periodCommitments, reserveMarginKw } from './period-options';
import { infeasiblePlan, scheduleTotals } from './plan-output';
import { infeasiblePeriodsOf, validatePlanProblem } from './plan-voyage';
import type { PlanProblem, PlannedPeriod, VoyagePlan } from './types';

export interface PmsThresholds {
  /** Start the next set when the load exceeds this % of the online rated capacity. Default 85 (common practice). */
  startAbovePct?: number;
  /** Stop one set when the load falls below this % of the online rated capacity. Default 50 (common practice). */
  stopBelowPct?: number;
  /** Unit ids in start order (first starts first, last stops first). Default: problem order. */
  priority?: string[];
}

/**
 * Plans as a power management system would: per load group, start sets in priority order while the load is
 * above startAbovePct of the online rated capacity or the mode's rules (minimum sets, reserve, N-1, maximum
 * load) are not met; stop the last-priority set (at most one per period) when the load is below
 * stopBelowPct, provided the rest then meet the rules, stay below startAbovePct (no hunting) and the set has
 * run its minimum up time. Running sets share the load at equal % of rating. Running-hour budgets are not
 * considered (a PMS does not know them).
 *
 * Cost: O(T·n²). Throws on malformed input or thresholds with stopBelowPct ≥ startAbovePct; periods no set
 * combination can serve make an infeasible result with reasons.
 *
 * @example baselinePlan(problem, { startAbovePct: 85, stopBelowPct: 50 }).totalFuelKg
 */
export function baselinePlan(problem: PlanProblem, thresholds: PmsThresholds = {}): VoyagePlan {
  validatePlanProblem(problem, 'baselinePlan');
  const startPct = thresholds.startAbovePct ?? 85;
  const stopPct = thresholds.stopBelowPct ?? 50;
  if (!(stopPct < startPct) || !(startPct > 0)) throw new Error('baselinePlan requires 0 < stopBelowPct < startAbovePct');
  const bad = infeasiblePeriodsOf(periodCommitments(problem));
  if (bad.length) return infeasiblePlan(problem, 'baseline', bad, []);
  const { units } = problem;
  const models = units.map(unitCostModel);
  const order = (thresholds.priority ?? units.map((u) => u.id)).map((id) => {
    const i = units.findIndex((u) => u.id === id);
    if (i < 0) throw new Error(`baselinePlan: unknown unit ${id} in the priority order`);
    return i;
  });
  for (let i = 0; i < units.length; i++) if (!order.includes(i)) order.push(i);
  const running = units.map((u) => (problem.initialState?.[u.id]?.on ?? false) && u.available);
  const sinceH = units.map((u) => problem.initialState?.[u.id]?.hoursInState ?? Infinity);
  const masks: number[] = [];
  const periods: PlannedPeriod[] = [];
  let runningFuelKg = 0;
  for (const p of problem.periods) {
    const before = running.slice();
    units.forEach((u, i) => {
      if (!u.available) running[i] = false;
      if (u.mustRun) running[i] = true;
    });
    const loadsKw = new Array<number>(units.length).fill(0);
    for (const g of loadGroups(units, p)) {
      const members = order.filter((i) => g.unitIndices.includes(i));
      const L = g.loadKw;
      const sum = (f: (i: number) => number, set: number[]) => set.reduce((a, i) => a + f(i), 0);
      const meets = (set: number[]) => {
        const maxKw = sum((i) => models[i].maxKw, set);
        const largest = Math.max(0, ...set.map((i) => models[i].maxKw));
        return (
          set.length >= p.rule.minSets &&
          maxKw >= L + reserveMarginKw(p.rule, L) - 1e-9 &&
          (!p.rule.nMinus1 || L <= 0 || maxKw - largest >= L - 1e-9) &&
          sum((i) => models[i].minKw, set) <= L + 1e-9
        );
      };
      const rated = (set: number[]) => sum((i) => units[i].ratedKw, set);
      let on = members.filter((i) => running[i]);
      // Starts: threshold or rules.
      while (L > (startPct / 100) * rated(on) || !meets(on)) {
        const idle = members.filter((i) => !running[i] && units[i].available);
        if (!idle.length) break;
        const next = idle.find((i) => sinceH[i] >= units[i].minDownH) ?? idle[0];
        running[next] = true;
        on = members.filter((i) => running[i]);
        if (meets(on) && L <= (startPct / 100) * rated(on)) break;
      }
      // One stop: the last in priority order that may stop.
      if (L < (stopPct / 100) * rated(on)) {
        const candidates = on.filter((i) => !units[i].mustRun && before[i] && sinceH[i] >= units[i].minUpH).reverse();
        for (const c of candidates) {
          const rest = on.filter((i) => i !== c);
          if (rest.length && meets(rest) && L <= (startPct / 100) * rated(rest)) {
            running[c] = false;
            on = rest;
            break;
          }
        }
      }
      const share = L / Math.max(1e-9, rated(on));
      for (const i of on) loadsKw[i] = Math.min(models[i].maxKw, Math.max(models[i].minKw, share * units[i].ratedKw));
    }
    units.forEach((_, i) => {
      if (running[i] !== before[i]) sinceH[i] = 0;
      sinceH[i] += p.durationH;
    });
    const mask = running.reduce((m, r, i) => (r ? m | (1 << i) : m), 0);
    masks.push(mask);
    const fuelKg = units.reduce((a, _, i) => a + (running[i] ? modelFuelKgPerH(models[i], loadsKw[i]) : 0), 0) * p.durationH;
    runningFuelKg += fuelKg;
    periods.push({ runningIds: units.filter((_, i) => running[i]).map((u) => u.id), loadsKw, fuelKg });
  }
  const { starts, hours } = scheduleTotals(problem, masks);
  const startFuelKg = units.reduce((a, u, i) => a + starts[i] * u.startCostKg, 0);
  return {
    solver: 'baseline',
    status: 'best-found',
    statusText: `baseline: start above ${startPct} %, stop below ${stopPct} % of online capacity, equal split`,
    periods,
    runningFuelKg,
    startFuelKg,
    totalFuelKg: runningFuelKg + startFuelKg,
    units: units.map((u, i) => ({ unitId: u.id, starts: starts[i], runningHours: hours[i], budgetH: problem.maxRunningHours?.[u.id] ?? null })),
    lowerBoundKg: null,
    gapPct: null,
    infeasiblePeriods: [],
    reasons: [],
  };
}
