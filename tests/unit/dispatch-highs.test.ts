import { beforeAll, describe, expect, it } from 'vitest';
import highsLoader from 'highs';
import { dispatchLoad, rankCombinations } from '../../optimizer/dispatch';
import { solveSinglePointMilp, type LpSolver } from '../../optimizer/dispatch/milp';
import { createRng } from '../../optimizer/random';
import { randomInstance, randomSet } from '../fixtures/dispatch/random-plants';

/** Best combination's fuel rate vs HiGHS's MILP optimum, relative. */
const FUEL_REL_TOL = 1e-6;
/** Per-set loads of the exact dispatch vs the HiGHS LP for a fixed set of sets, kW (ties aside). */
const INSTANCES = 60;
const SEED = 20260101;

let highs: LpSolver;
beforeAll(async () => {
  // Reference: HiGHS (npm `highs`), a general-purpose MILP solver (University of Edinburgh), compiled to WASM.
  highs = (await highsLoader()) as unknown as LpSolver;
});

describe('rankCombinations against HiGHS (general-purpose MILP reference solver)', () => {
  it(`${INSTANCES} seeded random instances: same feasibility, best fuel equal to the MILP optimum to ${FUEL_REL_TOL} relative`, () => {
    const rng = createRng(SEED);
    let feasible = 0;
    let openTie = 0;
    let withNMinus1 = 0;
    for (let k = 0; k < INSTANCES; k++) {
      const { units, demand, rule } = randomInstance(rng);
      const ours = rankCombinations(units, demand, rule);
      const reference = solveSinglePointMilp(highs, units, demand, rule);
      const context = JSON.stringify({ k, demand, rule });
      expect(ours.feasible, context).toBe(reference.feasible);
      if (!ours.feasible || !reference.feasible) {
        if (!reference.feasible) expect(reference.status, context).toBe('Infeasible');
        continue;
      }
      feasible++;
      if (!rule.busTieClosed) openTie++;
      if (rule.nMinus1) withNMinus1++;
      const rel = Math.abs(ours.best.fuelKgPerH - reference.fuelKgPerH) / reference.fuelKgPerH;
      expect(rel, context).toBeLessThan(FUEL_REL_TOL);
      // Ranking is ascending in fuel.
      for (let i = 1; i < ours.combinations.length; i++) {
        expect(ours.combinations[i].fuelKgPerH).toBeGreaterThanOrEqual(ours.combinations[i - 1].fuelKgPerH);
      }
    }
    // The sample must exercise the feasible, open-tie and N-1 paths, or the comparison proves little.
    expect(feasible).toBeGreaterThanOrEqual(30);
    expect(openTie).toBeGreaterThanOrEqual(5);
    expect(withNMinus1).toBeGreaterThanOrEqual(10);
  });

  it('piecewise dispatch of a fixed set of sets equals the HiGHS optimum with all sets must-run', () => {
    const rng = createRng(SEED + 1);
    for (let k = 0; k < 20; k++) {
      const units = Array.from({ length: rng.int(2, 6) }, (_, i) => ({
        ...randomSet(rng, i, 'A'),
        available: true,
        mustRun: true,
      }));
      const minKw = units.reduce((s, u) => s + (u.ratedKw * u.minLoadPct) / 100, 0);
      const maxKw = units.reduce((s, u) => s + (u.ratedKw * u.maxLoadPct) / 100, 0);
      const loadKw = minKw + (maxKw - minKw) * rng.uniform();
      const ours = dispatchLoad(units, loadKw);
      const rule = { marginKw: 0, marginPct: 0, minSets: 0, nMinus1: false, busTieClosed: true };
      const reference = solveSinglePointMilp(highs, units, loadKw, rule);
      expect(ours.feasible && reference.feasible).toBe(true);
      if (!ours.feasible || !reference.feasible) continue;
      expect(Math.abs(ours.fuelKgPerH - reference.fuelKgPerH) / reference.fuelKgPerH).toBeLessThan(FUEL_REL_TOL);
    }
  });
});
