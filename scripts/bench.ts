/**
 * `npm run bench`: runs every benchmark in bench/ one after another, in one process each, and lets each print its
 * figures as `bench <name> <value> <unit>` beside the reference it measures in the same run. Benchmarks that need a
 * database get a throwaway cluster in .tmp/pg-bench through KILOWATCH_BENCH_ADMIN_URL.
 *
 * `npm run bench -- plan` runs only the files whose name contains "plan".
 */
import { spawn } from 'node:child_process';
import { readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { ROOT } from './lib/bootstrap';
import { ensureCluster, freePort, stopCluster } from './lib/postgres';

const CLUSTER_DIR = path.join(ROOT, '.tmp', 'pg-bench');

async function main(): Promise<number> {
  const filter = process.argv.slice(2).filter((a) => a !== '--');
  const files = readdirSync(path.join(ROOT, 'bench'))
    .filter((f) => f.endsWith('.ts') && !f.startsWith('_'))
    .filter((f) => filter.length === 0 || filter.some((x) => f.includes(x)))
    .sort();
  stopCluster(CLUSTER_DIR);
  rmSync(CLUSTER_DIR, { recursive: true, force: true });
  rmSync(`${CLUSTER_DIR}.secret`, { force: true });
  const cluster = await ensureCluster(CLUSTER_DIR, await freePort());
  let failures = 0;
  try {
    for (const file of files) {
      console.log(`# ${file}`);
      const code = await new Promise<number>((resolve) => {
        const child = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), [path.join('bench', file)], {
          cwd: ROOT,
          stdio: 'inherit',
          env: { ...process.env, KILOWATCH_BENCH_ADMIN_URL: cluster.adminUrl, NODE_ENV: 'production' },
        });
        child.once('exit', (c) => resolve(c ?? 1));
      });
      if (code !== 0) {
        failures++;
        console.log(`# ${file} failed with exit ${code}`);
      }
    }
  } finally {
    stopCluster(CLUSTER_DIR);
    rmSync(CLUSTER_DIR, { recursive: true, force: true });
    rmSync(`${CLUSTER_DIR}.secret`, { force: true });
  }
  return failures ? 1 : 0;
}

main()
  .then((code) => process.exit(code))
  .catch((err: Error) => {
    console.error(err.stack ?? err.message);
    process.exit(1);
  });
