/**
 * `npx tsx seed/bench.ts`: speed of the demo scenario. Prints `bench <name> <value> <unit>` lines.
 * Always: generateScenario (median of 5 runs). With DATABASE_URL set to an EMPTY, migrated database: seedDemo
 * inside an outer transaction that is rolled back (median of 3 runs), so the database stays empty.
 */
import { connect } from '../server/db/client';
import { generateScenario, seedDemo } from '../seed/index';
import { benchDatabase } from './_db';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

class Rollback extends Error {}

async function main(): Promise<void> {
  const generateMs: number[] = [];
  let logRows = 0;
  for (let i = 0; i < 5; i++) {
    const started = performance.now();
    logRows = generateScenario().logs.length;
    generateMs.push(performance.now() - started);
  }
  console.log(`bench seed-generate-scenario ${median(generateMs).toFixed(0)} ms`);
  console.log(`bench seed-log-rows ${logRows} rows`);

  const url = process.env.DATABASE_URL ?? (await benchDatabase('seed'));
  if (!url) {
    console.log('(set DATABASE_URL to an empty, migrated database to time seedDemo as well)');
    return;
  }
  const database = connect(url, 2);
  try {
    const seedMs: number[] = [];
    for (let i = 0; i < 3; i++) {
      const started = performance.now();
      try {
        await database.db.transaction(async (tx) => {
          await seedDemo(tx);
          seedMs.push(performance.now() - started);
          throw new Rollback();
        });
      } catch (err) {
        if (!(err instanceof Rollback)) throw err;
      }
    }
    console.log(`bench seed-demo-insert ${(median(seedMs) / 1000).toFixed(2)} s`);
  } finally {
    await database.close();
  }
}

main().catch((err: Error) => {
  console.error(err.message);
  process.exit(1);
});
