/**
 * Benchmark of the savings computations: one vessel with four sets, a year of logged days in two modes each,
 * costed with fitted curves (delta-method intervals), and the seeded sampling of one month.
 * Prints `bench <name> <value> <unit>` lines.
 */
import { fitFuelCurve, generateDailyLogs } from '../optimizer/fit/index';
import type { GensetUnit, QuadraticFuelCurve, ReserveRule } from '../optimizer/plant';
import { createRng } from '../optimizer/random';
import { sampleSavings, vesselSavings, type CurveUncertainty, type SavingsDay } from '../optimizer/savings/index';

const curves: QuadraticFuelCurve[] = [
  { kind: 'quadratic', a: 25, b: 0.19, c: 3e-5 },
  { kind: 'quadratic', a: 27, b: 0.188, c: 3.2e-5 },
  { kind: 'quadratic', a: 35, b: 0.18, c: 4e-5 },
  { kind: 'quadratic', a: 15, b: 0.2, c: 5e-5 },
];
const rated = [1000, 1000, 1200, 600];
const units: GensetUnit[] = curves.map((curve, i) => ({
  id: `DG${i + 1}`, name: `DG${i + 1}`, ratedKw: rated[i], minLoadPct: 25, maxLoadPct: 100, curve, busSection: 'A',
  available: true, mustRun: false, startCostKg: 0, minUpH: 0, minDownH: 0,
}));
const rng = createRng(42);
const fits: Record<string, CurveUncertainty> = {};
units.forEach((u, i) => {
  fits[u.id] = fitFuelCurve(generateDailyLogs(rng, { curve: curves[i], ratedKw: u.ratedKw, days: 120, minLoadPct: 25 }), { ratedKw: u.ratedKw });
});
const sea: ReserveRule = { marginKw: 200, marginPct: 10, minSets: 2, nMinus1: false, busTieClosed: true };
const port: ReserveRule = { marginKw: 100, marginPct: 10, minSets: 1, nMinus1: false, busTieClosed: true };
const days: SavingsDay[] = Array.from({ length: 365 }, (_, d) => {
  const seaH = rng.int(0, 24);
  const loadKw = 900 + 700 * rng.uniform();
  const sets = [0, 1, 2].map((i) => ({ unitId: units[i].id, hoursRun: 24, kwh: ((loadKw * rated[i]) / 3200) * 24 }));
  return {
    date: new Date(Date.UTC(2024, 0, 1 + d)).toISOString().slice(0, 10),
    modeHours: { sea: seaH, port: 24 - seaH },
    modeLoadsKw: { sea: loadKw * 1.2, port: loadKw * 0.7 },
    sets,
    fuel: { grade: 'VLSFO' },
  };
});
const input = { units, fits, rules: { sea, port }, days };

function timeMs(run: () => void, repeats: number): number {
  run();
  const t0 = performance.now();
  for (let i = 0; i < repeats; i++) run();
  return (performance.now() - t0) / repeats;
}

const yearMs = timeMs(() => vesselSavings(input, { prices: [{ grade: 'VLSFO', pricePerT: 620, currency: 'USD', validFrom: '2024-01-01' }] }), 5);
console.log(`bench savings_year_365_days_ms ${yearMs.toFixed(1)} ms`);
console.log(`bench savings_per_day_us ${((1000 * yearMs) / 365).toFixed(1)} us`);
const monthInput = { ...input, days: days.slice(0, 31) };
const sampleMs = timeMs(() => sampleSavings(monthInput, { samples: 200, seed: 1 }), 1);
console.log(`bench savings_sampling_month_200_draws_ms ${sampleMs.toFixed(0)} ms`);
const delta = vesselSavings(monthInput).period.avoidableFuelT;
const sampled = sampleSavings(monthInput, { samples: 500, seed: 1 }).period;
console.log(`bench savings_month_sd_sampling_over_delta ${(sampled.sdKg / (delta.sd * 1000)).toFixed(3)} ratio`);
