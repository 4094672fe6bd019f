/**
 * Refit every set of a generated fleet: 50 vessels × 4 sets × 5 years of daily logs (seeded).
 * Prints `bench <name> <value> <unit>` lines. Run: npx tsx bench/refit-fleet.ts
 */
import { performance } from 'node:perf_hooks';
import { pathToFileURL } from 'node:url';
import { linearRegression } from 'simple-statistics';
import { fitDrift, fitFuelCurve, generateDailyLogs, type DailyFuelPoint } from '../optimizer/fit';
import { createRng } from '../optimizer/random';

const VESSELS = 50;
const SETS_PER_VESSEL = 4;
const DAYS = 5 * 365 + 1;

interface FleetSet {
  ratedKw: number;
  points: DailyFuelPoint[];
}

function generateFleet(seed: number): FleetSet[] {
  const rng = createRng(seed);
  const sets: FleetSet[] = [];
  for (let v = 0; v < VESSELS; v++) {
    for (let s = 0; s < SETS_PER_VESSEL; s++) {
      const ratedKw = [800, 1000, 1500, 2400][rng.int(0, 3)];
      // SFOC ≈ 200 g/kWh near 75 % load, with set-to-set spread (illustrative figures).
      const scale = ratedKw / 1000;
      const curve = { kind: 'quadratic' as const, a: 60 * scale * (0.8 + 0.4 * rng.uniform()), b: 0.045 + 0.01 * rng.uniform(), c: (1e-4 / scale) * (0.8 + 0.4 * rng.uniform()) };
      const points = generateDailyLogs(createRng(seed * 1000 + v * 10 + s), {
        curve,
        ratedKw,
        days: DAYS,
        noiseSdKgPerH: 2 * scale,
        driftGPerKwhPer1000h: rng.uniform(),
      });
      // 2 % gross logging errors.
      for (let k = 0; k < DAYS / 50; k++) points[rng.int(0, DAYS - 1)].fuelKgPerH *= 1.3;
      sets.push({ ratedKw, points });
    }
  }
  return sets;
}

/** Best (least) wall time of `repeats` runs, and the process CPU time of that run (the machine may be shared). */
function timed(repeats: number, run: () => void): { wallS: number; cpuS: number } {
  let best = { wallS: Infinity, cpuS: Infinity };
  for (let r = 0; r < repeats; r++) {
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    const wallS = (performance.now() - t0) / 1000;
    const cpu = process.cpuUsage(cpu0);
    if (wallS < best.wallS) best = { wallS, cpuS: (cpu.user + cpu.system) / 1e6 };
  }
  return best;
}

export function main(repeats = 3): void {
  const fleet = generateFleet(2024);
  const totalPoints = fleet.reduce((n, s) => n + s.points.length, 0);

  let iterations = 0;
  let outliers = 0;
  const refit = timed(repeats, () => {
    iterations = 0;
    outliers = 0;
    for (const set of fleet) {
      const fit = fitFuelCurve(set.points, { ratedKw: set.ratedKw });
      iterations += fit.iterations;
      outliers += fit.outliers.length;
    }
  });

  let checksum = 0;
  const ols = timed(repeats, () => {
    for (const set of fleet) checksum += linearRegression(set.points.map((p) => [p.loadKw, p.fuelKgPerH])).m;
  });

  let alerts = 0;
  const drift = timed(1, () => {
    for (const set of fleet) if (fitDrift(set.points, { ratedKw: set.ratedKw }).alert) alerts++;
  });

  console.log(`bench refit_fleet_s ${refit.wallS.toFixed(3)} s`);
  console.log(`bench refit_fleet_cpu_s ${refit.cpuS.toFixed(3)} s`);
  console.log(`bench refit_fleet_ols_reference_s ${ols.wallS.toFixed(3)} s`);
  console.log(`bench refit_fleet_drift_s ${drift.wallS.toFixed(3)} s`);
  console.log(`bench refit_fleet_sets ${fleet.length} sets`);
  console.log(`bench refit_fleet_points ${totalPoints} points`);
  console.log(`bench refit_fleet_mean_irls_iterations ${(iterations / fleet.length).toFixed(1)} iterations`);
  console.log(`bench refit_fleet_outliers_listed ${outliers} days`);
  console.log(`bench refit_fleet_drift_alerts ${alerts} sets`);
  if (!Number.isFinite(checksum)) throw new Error('reference regression failed');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) main();
