/**
 * Voyage-plan benchmark: seeded fleets with quadratic curves as chord segments (the same curves the MILP
 * models), load a random walk between 30 and 80 % of capacity, reserve margins and running-hour budgets.
 * Prints `bench <name> <value> <unit>` lines. Run: npx tsx bench/plan.ts
 */
import { loadHighs, solvePlanMilp } from '../optimizer/plan/plan-milp';
import { periodCommitments } from '../optimizer/plan/period-options';
import { planVoyage } from '../optimizer/plan/plan-voyage';
import { randomPlanProblem } from '../optimizer/plan/random-problem';
import type { PlanProblem } from '../optimizer/plan/types';

function fleet(units: number, periods: number, firstSeed: number): PlanProblem {
  for (let seed = firstSeed; seed < firstSeed + 200; seed++) {
    const p = randomPlanProblem(seed, {
      units,
      periods,
      chordSegments: 4 + (seed % 3),
      loadFromFraction: 0.3,
      loadToFraction: 0.8,
      nMinus1: 0,
      openTie: 0,
      budgets: 0.5,
      maxMinUpH: 2,
      unavailable: 0,
      mustRun: 0,
    });
    // The first seed whose every period has a feasible commitment.
    if (!periodCommitments(p).some((c) => c.reason)) return p;
  }
  throw new Error('bench/plan: no feasible seeded fleet found');
}

function timed<T>(f: () => T): { value: T; s: number } {
  const t0 = performance.now();
  const value = f();
  return { value, s: (performance.now() - t0) / 1000 };
}

const line = (name: string, value: number, unit: string) => console.log(`bench ${name} ${Number(value.toPrecision(4))} ${unit}`);

const p4 = fleet(4, 168, 4100);
timed(() => planVoyage(p4)); // warm-up (JIT)
line('plan_4x168_s', timed(() => planVoyage(p4)).s, 's');

const p6 = fleet(6, 720, 6100);
const r6 = timed(() => planVoyage(p6));
line('plan_6x720_s', r6.s, 's');
line('plan_6x720_gap_pct', r6.value.gapPct ?? NaN, '%');

const p8 = fleet(8, 720, 8100);
const r8 = timed(() => planVoyage(p8));
line('plan_8x720_s', r8.s, 's');
const highs = await loadHighs();
const t0 = performance.now();
const h8 = await solvePlanMilp(p8, { highs, timeLimitS: 60 });
line('highs_8x720_s', (performance.now() - t0) / 1000, 's');
line('plan_8x720_vs_highs_cost_ratio', r8.value.totalFuelKg / h8.totalFuelKg, 'ratio');
const bestLb = Math.max(r8.value.lowerBoundKg ?? -Infinity, h8.lowerBoundKg ?? -Infinity);
line('plan_8x720_gap_to_best_bound_pct', (100 * (r8.value.totalFuelKg - bestLb)) / r8.value.totalFuelKg, '%');
line('highs_8x720_gap_pct', h8.gapPct ?? NaN, '%');
console.log(`# 8x720 ours: ${r8.value.statusText}; HiGHS: ${h8.statusText}`);
