/**
 * Turns a commitment schedule (one mask per period) into the reported plan: loads, fuel, starts, hours.
 */
import { unitCostModel } from './load-sharing';
import { commitmentLoads } from './period-options';
import type { InfeasiblePeriod, PlanProblem, PlanStatus, PlannedPeriod, UnitPlanTotals, VoyagePlan } from './types';

/**
 * Status of a plan from its total and a lower bound: "optimal" when the relative gap is at most
 * `optimalityGap`, else "within x % of the lower bound"; "best found" without a bound.
 *
 * Cost: O(1). Does not throw.
 *
 * @example planStatus(100, 99.9, 1e-6) // { status: 'within-gap', statusText: 'within 0.1 % of the lower bound', gapPct: 0.1 }
 */
export function planStatus(totalKg: number, lowerBoundKg: number | null, optimalityGap: number): { status: PlanStatus; statusText: string; gapPct: number | null } {
  if (lowerBoundKg === null || !Number.isFinite(lowerBoundKg)) return { status: 'best-found', statusText: 'best found', gapPct: null };
  const gap = totalKg > 0 ? Math.max(0, (totalKg - lowerBoundKg) / totalKg) : 0;
  if (gap <= optimalityGap) return { status: 'optimal', statusText: 'optimal', gapPct: 100 * gap };
  return { status: 'within-gap', statusText: `within ${(100 * gap).toPrecision(2)} % of the lower bound`, gapPct: 100 * gap };
}

/** Running hours and starts per unit of a schedule. */
export function scheduleTotals(problem: PlanProblem, masks: ArrayLike<number>): { starts: number[]; hours: number[] } {
  const n = problem.units.length;
  const starts = new Array<number>(n).fill(0);
  const hours = new Array<number>(n).fill(0);
  let prev = 0;
  problem.units.forEach((u, i) => {
    if (problem.initialState?.[u.id]?.on) prev |= 1 << i;
  });
  for (let t = 0; t < masks.length; t++) {
    const m = masks[t];
    for (let i = 0; i < n; i++) {
      if (!((m >> i) & 1)) continue;
      hours[i] += problem.periods[t].durationH;
      if (!((prev >> i) & 1)) starts[i]++;
    }
    prev = m;
  }
  return { starts, hours };
}

/**
 * The reported plan of a commitment schedule: every period re-dispatched exactly, fuel, starts, hours.
 *
 * Cost: O(T · dispatch). Throws when a mask cannot carry its period's load (a solver defect).
 *
 * @example buildPlan(problem, masks, 'decomposition', 1234.5, 1e-6).totalFuelKg
 */
export function buildPlan(problem: PlanProblem, masks: ArrayLike<number>, solver: VoyagePlan['solver'], lowerBoundKg: number | null, optimalityGap: number): VoyagePlan {
  const { units } = problem;
  const models = units.map(unitCostModel);
  const periods: PlannedPeriod[] = [];
  let runningFuelKg = 0;
  for (let t = 0; t < masks.length; t++) {
    const p = problem.periods[t];
    const share = commitmentLoads(units, models, p, masks[t]);
    if (!share) throw new Error(`buildPlan: the commitment of period ${t + 1} cannot carry its load`);
    const fuelKg = share.fuelKgPerH * p.durationH;
    runningFuelKg += fuelKg;
    periods.push({ runningIds: units.filter((_, i) => (masks[t] >> i) & 1).map((u) => u.id), loadsKw: share.loadsKw, fuelKg });
  }
  const { starts, hours } = scheduleTotals(problem, masks);
  let startFuelKg = 0;
  const unitTotals: UnitPlanTotals[] = units.map((u, i) => {
    startFuelKg += starts[i] * u.startCostKg;
    return { unitId: u.id, starts: starts[i], runningHours: hours[i], budgetH: problem.maxRunningHours?.[u.id] ?? null };
  });
  const totalFuelKg = runningFuelKg + startFuelKg;
  const lb = lowerBoundKg === null ? null : Math.min(lowerBoundKg, totalFuelKg);
  return {
    solver,
    ...planStatus(totalFuelKg, lb, optimalityGap),
    periods,
    runningFuelKg,
    startFuelKg,
    totalFuelKg,
    units: unitTotals,
    lowerBoundKg: lb,
    infeasiblePeriods: [],
    reasons: [],
  };
}

/**
 * An infeasible plan: no schedule, with the periods and plan-wide reasons that make it so.
 *
 * Cost: O(units). Does not throw.
 *
 * @example infeasiblePlan(problem, 'decomposition', [{ index: 3, reason: 'load 900 kW exceeds ...' }], [])
 */
export function infeasiblePlan(problem: PlanProblem, solver: VoyagePlan['solver'], infeasiblePeriods: InfeasiblePeriod[], reasons: string[]): VoyagePlan {
  const first = infeasiblePeriods[0] ? `period ${infeasiblePeriods[0].index + 1}: ${infeasiblePeriods[0].reason}` : (reasons[0] ?? 'no feasible plan');
  return {
    solver,
    status: 'infeasible',
    statusText: `infeasible: ${first}`,
    periods: [],
    runningFuelKg: 0,
    startFuelKg: 0,
    totalFuelKg: 0,
    units: problem.units.map((u) => ({ unitId: u.id, starts: 0, runningHours: 0, budgetH: problem.maxRunningHours?.[u.id] ?? null })),
    lowerBoundKg: null,
    gapPct: null,
    infeasiblePeriods,
    reasons,
  };
}
