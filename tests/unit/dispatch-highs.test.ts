import { beforeAll, describe, expect, it } from 'vitest';
import highsLoader from 'highs';
import { dispatchLoad, rankCombinations } from '../../optimizer/dispatch';
import { solveSinglePointMilp, type LpSolver } from '../../optimizer/dispatch/milp';
import { createRng } from '../../optimizer/random';
import { randomInstance, randomSet } from '../fixtures/dispatch/random-plants';
import { curveFuelKgPerH, type GensetUnit } from '../../optimizer/plant';

/**
 * Economic dispatch of fixed running sets as a convex QP in CPLEX LP format (HiGHS reads quadratic objectives as
 * `[ 2c x^2 ] / 2`): quadratic sets by their load, piecewise sets by segment loads above the minimum. Loads are
 * in MW (kW / 1000) so the Hessian is well scaled for the solver. Constant terms (a, fuel at minimum) are added
 * back outside the solver.
 */
const KW_PER_MW = 1000;
function dispatchQp(units: GensetUnit[], loadKw: number): { lp: string; constantKgPerH: number } {
  const linear: string[] = [];
  const quadratic: string[] = [];
  const balance: string[] = [];
  const bounds: string[] = [];
  let constantKgPerH = 0;
  let fixedKw = 0;
  units.forEach((u, i) => {
    const minKw = (u.ratedKw * u.minLoadPct) / 100;
    const maxKw = (u.ratedKw * u.maxLoadPct) / 100;
    if (u.curve.kind === 'quadratic') {
      constantKgPerH += u.curve.a;
      linear.push(`+ ${u.curve.b * KW_PER_MW} p${i}`);
      quadratic.push(`${2 * u.curve.c * KW_PER_MW * KW_PER_MW} p${i} ^ 2`);
      balance.push(`+ p${i}`);
      bounds.push(` ${minKw / KW_PER_MW} <= p${i} <= ${maxKw / KW_PER_MW}`);
      return;
    }
    const xs = u.curve.breakpointsKw;
    const ys = u.curve.fuelKgPerH;
    fixedKw += minKw;
    constantKgPerH += curveFuelKgPerH(u.curve, minKw);
    for (let j = 1; j < xs.length; j++) {
      const from = Math.max(xs[j - 1], minKw);
      const to = Math.min(xs[j], maxKw);
      if (to <= from) continue;
      const slope = (ys[j] - ys[j - 1]) / (xs[j] - xs[j - 1]);
      linear.push(`+ ${slope * KW_PER_MW} s${i}_${j}`);
      balance.push(`+ s${i}_${j}`);
      bounds.push(` 0 <= s${i}_${j} <= ${(to - from) / KW_PER_MW}`);
    }
  });
  const objective = `${linear.join(' ')}${quadratic.length ? ` + [ ${quadratic.join(' + ')} ] / 2` : ''}`;
  const rhs = (loadKw - fixedKw) / KW_PER_MW;
  const lp = ['Minimize', ` obj: ${objective}`, 'Subject To', ` bal: ${balance.join(' ')} = ${rhs}`, 'Bounds', ...bounds, 'End', ''].join('\n');
  return { lp, constantKgPerH };
}

/** Best combination's fuel rate (or a fixed set's dispatch) vs the HiGHS optimum, relative. */
const FUEL_REL_TOL = 1e-6;
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

  it('quadratic and mixed dispatch of fixed running sets equals the HiGHS convex QP optimum', () => {
    const rng = createRng(SEED + 2);
    let clamped = 0;
    for (let k = 0; k < 40; k++) {
      const units = Array.from({ length: rng.int(2, 8) }, (_, i): GensetUnit => {
        const u = randomSet(rng, i, 'A');
        const b = 0.17 + 0.04 * rng.uniform();
        const c = (0.005 + 0.05 * rng.uniform()) / u.ratedKw;
        // Every third instance keeps some piecewise sets: mixed plants go through the same bisection.
        const keepPiecewise = k % 3 === 0 && i % 2 === 0;
        return keepPiecewise ? u : { ...u, curve: { kind: 'quadratic', a: 0.03 * u.ratedKw, b, c } };
      });
      const minKw = units.reduce((s, u) => s + (u.ratedKw * u.minLoadPct) / 100, 0);
      const maxKw = units.reduce((s, u) => s + (u.ratedKw * u.maxLoadPct) / 100, 0);
      const loadKw = minKw + (maxKw - minKw) * rng.uniform();
      const ours = dispatchLoad(units, loadKw);
      const { lp, constantKgPerH } = dispatchQp(units, loadKw);
      const reference = highs.solve(lp, { output_flag: false });
      expect(reference.Status).toBe('Optimal');
      expect(ours.feasible).toBe(true);
      if (!ours.feasible) continue;
      const referenceFuel = reference.ObjectiveValue + constantKgPerH;
      expect(Math.abs(ours.fuelKgPerH - referenceFuel) / referenceFuel).toBeLessThan(FUEL_REL_TOL);
      if (ours.units.some((u) => u.loadPct >= units.find((x) => x.id === u.id)!.maxLoadPct - 1e-9)) clamped++;
    }
    // Some instances must have a set at its upper limit, so the clamping path is exercised.
    expect(clamped).toBeGreaterThanOrEqual(5);
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
