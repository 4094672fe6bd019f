// Throughput of the fuel corrections and the daily-log derivation. Run: npx tsx bench/logs-derive.ts
import { volumeCorrectionFactor54B } from '../optimizer/fuel';
import { deriveGensetSeries } from '../optimizer/logs';
import type { RawDailyLog } from '../optimizer/logs';
import { createRng } from '../optimizer/random';

function timeMs(fn: () => void, reps: number): number {
  fn(); // warm-up
  const t0 = performance.now();
  for (let i = 0; i < reps; i++) fn();
  return (performance.now() - t0) / reps;
}

const rng = createRng(42);
const pairs = Array.from({ length: 100_000 }, () => [653 + rng.uniform() * 422, -18 + rng.uniform() * 100] as const);
let sink = 0;
const vcfMs = timeMs(() => {
  for (const [rho, t] of pairs) sink += volumeCorrectionFactor54B(rho, t);
}, 5);
console.log(`bench vcf54b ${((vcfMs * 1e6) / pairs.length).toFixed(1)} ns/call`);

// Ten years of one genset's days with cumulative meters and volume fuel.
const days = 3650;
let h = 10_000;
let kwh = 5_000_000;
const logs: RawDailyLog[] = [];
for (let d = 0; d < days; d++) {
  const run = 12 + rng.uniform() * 12;
  const load = 300 + rng.uniform() * 600;
  h += run;
  kwh += run * load;
  logs.push({
    date: new Date(Date.UTC(2020, 0, 1 + d)).toISOString().slice(0, 10),
    gensetId: 'DG1',
    runningHours: { kind: 'cumulative', readingH: h },
    energy: { kind: 'cumulative', readingKwh: kwh },
    fuel: { kind: 'volume', value: (run * load * 0.22) / 0.96, unit: 'L', tempC: 30 + rng.uniform() * 20 },
  });
}
const ctx = {
  ratedKw: 1000,
  minLoadPct: 30,
  lot: { grade: 'VLSFO' as const, density15KgPerM3: 960, viscosity50Cst: 120, sulphurPct: 0.45 },
  previous: { runningHoursReadingH: 10_000, energyReadingKwh: 5_000_000 },
};
const seriesMs = timeMs(() => {
  sink += deriveGensetSeries(logs, ctx).rows.length;
}, 20);
console.log(`bench derive-genset-series-3650d ${seriesMs.toFixed(2)} ms`);
console.log(`bench derive-daily-row ${((seriesMs * 1e3) / days).toFixed(2)} us/row`);
if (sink === 0) console.log('unreachable');
