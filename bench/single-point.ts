/**
 * Single-operating-point recommendation speed: enumeration of all combinations of 8 sets (rankCombinations)
 * against the same problem solved as a MILP by HiGHS (npm `highs`), and whether both give the same optimum.
 * Run: npx tsx bench/single-point.ts
 */
import { rankCombinations } from '../optimizer/dispatch';
import { loadHighs, solveSinglePointMilp } from '../optimizer/dispatch/milp';
import { createRng } from '../optimizer/random';
import { randomInstance, type RandomInstance } from '../tests/fixtures/dispatch/random-plants';

const SETS = 8;
const INSTANCES = 40;
const REPEATS = 20;
const FUEL_REL_TOL = 1e-6;

async function main(): Promise<void> {
  const rng = createRng(8);
  const instances: RandomInstance[] = [];
  while (instances.length < INSTANCES) {
    const instance = randomInstance(rng, { minSets: SETS, maxSets: SETS });
    // All 8 sets switchable so every run enumerates 2^8 combinations.
    instance.units = instance.units.map((u) => ({ ...u, available: true, mustRun: false }));
    if (rankCombinations(instance.units, instance.demand, instance.rule).feasible) instances.push(instance);
  }
  for (const x of instances) rankCombinations(x.units, x.demand, x.rule); // warm-up

  let start = performance.now();
  for (let r = 0; r < REPEATS; r++) for (const x of instances) rankCombinations(x.units, x.demand, x.rule);
  const enumerationMs = (performance.now() - start) / (REPEATS * INSTANCES);

  const highs = await loadHighs();
  start = performance.now();
  const references = instances.map((x) => solveSinglePointMilp(highs, x.units, x.demand, x.rule));
  const highsMs = (performance.now() - start) / INSTANCES;

  let equal = 1;
  instances.forEach((x, i) => {
    const ours = rankCombinations(x.units, x.demand, x.rule);
    const ref = references[i];
    if (!ours.feasible || !ref.feasible) equal = 0;
    else if (Math.abs(ours.best.fuelKgPerH - ref.fuelKgPerH) / ref.fuelKgPerH > FUEL_REL_TOL) equal = 0;
  });

  // Same instances with smooth quadratic curves (lambda bisection instead of merit order).
  const quadratic = instances.map((x) => ({
    ...x,
    units: x.units.map((u) => ({ ...u, curve: { kind: 'quadratic' as const, a: 0.03 * u.ratedKw, b: 0.18, c: 2e-5 * (1000 / u.ratedKw) } })),
  }));
  start = performance.now();
  for (let r = 0; r < REPEATS; r++) for (const x of quadratic) rankCombinations(x.units, x.demand, x.rule);
  const quadraticMs = (performance.now() - start) / (REPEATS * INSTANCES);

  // Twelve switchable sets (4096 combinations), the most rankCombinations accepts by default.
  const big = randomInstance(createRng(12), { minSets: 12, maxSets: 12, openTieProbability: 0 });
  big.units = big.units.map((u) => ({ ...u, available: true, mustRun: false }));
  rankCombinations(big.units, big.demand, big.rule); // warm-up
  start = performance.now();
  for (let r = 0; r < 5; r++) rankCombinations(big.units, big.demand, big.rule);
  const twelveMs = (performance.now() - start) / 5;

  console.log(`bench single_point_ms ${enumerationMs.toFixed(3)} ms`);
  console.log(`bench single_point_quadratic_ms ${quadraticMs.toFixed(3)} ms`);
  console.log(`bench single_point_12_sets_ms ${twelveMs.toFixed(3)} ms`);
  console.log(`bench single_point_highs_ms ${highsMs.toFixed(3)} ms`);
  console.log(`bench single_point_equals_enumeration ${equal} bool`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
