// Speed of the overhaul computations: hours since maintenance over ten years of daily readings, and the stagger
// MILP (javascript-lp-solver) on the four-set fixture and on seeded random instances. Prints `bench <name> <value> <unit>`.
import { highsSolver, hoursSinceMaintenance, proposeHourBudgets, type StaggerInput } from '../optimizer/overhaul';
import { loadHighs } from '../optimizer/highs';
import { createRng } from '../optimizer/random';
import { FOUR_SETS } from '../tests/fixtures/overhaul/stagger-four-sets';

function time(fn: () => void, repeats: number): number {
  fn();
  const t = performance.now();
  for (let i = 0; i < repeats; i++) fn();
  return (performance.now() - t) / repeats;
}

function isoDay(day: number): string {
  return new Date(Date.UTC(2027, 0, 1 + day)).toISOString().slice(0, 10);
}

const rng = createRng(7);
let reading = 0;
const readings = Array.from({ length: 3650 }, (_, d) => ({ date: isoDay(d - 3650), readingH: (reading += 8 + 8 * rng.uniform()) }));
const record = { gensetId: 'DG1', readings, kinds: [{ kind: 'top', intervalHours: 12000 }, { kind: 'major', intervalHours: 24000 }], done: [{ kind: 'top', doneOn: isoDay(-1000), readingH: readings[2650].readingH }] };
console.log(`bench overhaul-hours-since-3650-days ${time(() => hoursSinceMaintenance(record), 20).toFixed(2)} ms`);
console.log(`bench overhaul-stagger-four-sets ${time(() => proposeHourBudgets(FOUR_SETS), 20).toFixed(1)} ms`);

function randomInstance(seed: number): StaggerInput {
  const r = createRng(seed);
  const horizon = r.int(120, 180);
  const n = r.int(3, 4);
  const windows = Array.from({ length: r.int(3, 6) }, (_, j) => {
    const start = r.int(10, horizon - 5);
    return { id: `W${j + 1}`, startsOn: isoDay(start), endsOn: isoDay(start + r.int(1, 3)) };
  });
  const sets = Array.from({ length: n }, (_, i) => ({ gensetId: `DG${i + 1}`, hoursLeftH: r.int(200, 2000), usageHPerDay: 12, fuelKgPerH: 180 + 60 * r.uniform() }));
  return { fromDate: isoDay(0), untilDate: isoDay(horizon), sets, windows, minGapDays: 14, requiredSetHoursPerDay: r.int(10, 8 * n) };
}
// The server's solve: HiGHS with its time limit enforced inside the solver (4 s per MILP).
const solve = highsSolver(await loadHighs(), 4000);
const times: number[] = [];
const statuses: Record<string, number> = {};
for (let s = 0; s < 20; s++) {
  if (process.env.BENCH_VERBOSE) console.error(`instance ${s}`);
  const input = randomInstance(100 + s);
  const t = performance.now();
  const p = proposeHourBudgets(input, { solve });
  times.push(performance.now() - t);
  const key = `${p.status}${p.proven ? '' : '-unproven'}`;
  statuses[key] = (statuses[key] ?? 0) + 1;
}
times.sort((a, b) => a - b);
console.log(`bench overhaul-stagger-random-median ${times[10].toFixed(1)} ms`);
console.log(`bench overhaul-stagger-random-max ${times[19].toFixed(1)} ms`);
for (const [k, v] of Object.entries(statuses)) console.log(`bench overhaul-stagger-random-${k} ${v} instances`);
