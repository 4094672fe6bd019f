import { beforeAll, describe, expect, it } from 'vitest';
import highsLoader from 'highs';
import { buildStaggerModel, linearModelToLp, prepareStagger, solveLinearModel, type StaggerInput } from '../../optimizer/overhaul';
import type { LpSolver } from '../../optimizer/dispatch/milp';
import { createRng } from '../../optimizer/random';

/** javascript-lp-solver's optimum vs HiGHS's on the same model, relative (fuel objectives are ~1e5 to 1e6 kg). */
const OBJ_REL_TOL = 1e-6;
const INSTANCES = 12;
const SEED = 20270101;

const EXACT = { output_flag: false, mip_rel_gap: 0, mip_abs_gap: 0, primal_feasibility_tolerance: 1e-9, mip_feasibility_tolerance: 1e-9 };

function isoDay(day: number): string {
  return new Date(Date.UTC(2027, 0, 1 + day)).toISOString().slice(0, 10);
}

/** Seeded random stagger instances: 2–4 sets, 60–90 days, 2–4 windows of 1–4 days. */
function randomInstance(seed: number): StaggerInput {
  const rng = createRng(seed);
  const horizon = rng.int(60, 90);
  const n = rng.int(2, 4);
  const windows = Array.from({ length: rng.int(2, 4) }, (_, j) => {
    const start = rng.int(5, horizon - 5);
    return { id: `W${j + 1}`, startsOn: isoDay(start), endsOn: isoDay(start + rng.int(0, 3)) };
  });
  const sets = Array.from({ length: n }, (_, i) => ({
    gensetId: `DG${i + 1}`,
    hoursLeftH: rng.int(100, 1200),
    usageHPerDay: rng.int(4, 20),
    fuelKgPerH: 180 + 60 * rng.uniform(),
  }));
  return { fromDate: isoDay(0), untilDate: isoDay(horizon), sets, windows, minGapDays: rng.int(3, 12), requiredSetHoursPerDay: rng.int(8, 12 * n) };
}

let highs: LpSolver;
beforeAll(async () => {
  // Reference: HiGHS (npm `highs`), a general-purpose MILP solver (University of Edinburgh), compiled to WASM.
  highs = (await highsLoader()) as unknown as LpSolver;
});

describe('stagger MILP: javascript-lp-solver equals HiGHS on the same model (seeded instances)', () => {
  it(`agrees on feasibility and optimum over ${INSTANCES} instances, window days and all slots`, () => {
    let feasibleCount = 0;
    let infeasibleCount = 0;
    for (let t = 0; t < INSTANCES; t++) {
      const p = prepareStagger(randomInstance(SEED + t));
      for (const candidateDistanceDays of [0, Infinity]) {
        const model = buildStaggerModel(p, { candidateDistanceDays, objective: 'fuel' });
        const ours = solveLinearModel(model);
        const ref = highs.solve(linearModelToLp(model), EXACT);
        expect(ours.feasible, `instance ${t}, distance ${candidateDistanceDays}: HiGHS says ${ref.Status}`).toBe(ref.Status === 'Optimal');
        if (ours.feasible) {
          feasibleCount++;
          expect(Math.abs(ours.objective - ref.ObjectiveValue) / Math.abs(ref.ObjectiveValue)).toBeLessThan(OBJ_REL_TOL);
        } else infeasibleCount++;
      }
    }
    // The seeded set must exercise both outcomes, or the comparison proves little.
    expect(feasibleCount).toBeGreaterThan(3);
    expect(infeasibleCount).toBeGreaterThan(0);
  });

  it('agrees on the window-distance objective (least days outside windows) on the small instances', () => {
    let compared = 0;
    for (let t = 0; t < INSTANCES; t++) {
      const input = randomInstance(SEED + t);
      if (input.sets.length > 3) continue;
      const model = buildStaggerModel(prepareStagger(input), { objective: 'window-distance' });
      const ours = solveLinearModel(model);
      const ref = highs.solve(linearModelToLp(model), EXACT);
      expect(ours.feasible).toBe(ref.Status === 'Optimal');
      if (ours.feasible) {
        compared++;
        expect(Math.abs(ours.objective - ref.ObjectiveValue)).toBeLessThan(1e-6);
      }
    }
    expect(compared).toBeGreaterThan(0);
  });
});

describe('stagger proposal with the HiGHS-backed solve (hard time limit)', () => {
  it('gives the same proposal as javascript-lp-solver on the hand-computed four-set fixture', async () => {
    const { FOUR_SETS } = await import('../fixtures/overhaul/stagger-four-sets');
    const { proposeHourBudgets, highsSolver } = await import('../../optimizer/overhaul');
    const viaLpSolver = proposeHourBudgets(FOUR_SETS);
    const viaHighs = proposeHourBudgets(FOUR_SETS, { solve: highsSolver(highs, 5000) });
    expect(viaHighs.status).toBe(viaLpSolver.status);
    expect(viaHighs.proven).toBe(true);
    expect(viaLpSolver.budgets.length).toBe(FOUR_SETS.sets.length);
    for (const set of viaLpSolver.budgets) {
      const other = viaHighs.budgets.find((s) => s.gensetId === set.gensetId)!;
      expect(other.dueDate).toBe(set.dueDate);
      expect(Math.abs(other.budgetH - set.budgetH)).toBeLessThan(1e-6);
    }
    expect(Math.abs(viaHighs.fuelDeltaKg - viaLpSolver.fuelDeltaKg)).toBeLessThan(1e-3);
  });
});
