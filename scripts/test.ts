/**
 * `npm test`: a throwaway PostgreSQL cluster of its own (never the demo data), the migrations into a template
 * database, then every test: unit and API integration (vitest; each integration file gets its own database copied
 * from the template), and browser tests (playwright-core driving Debian's chromium against the built app served
 * from a freshly seeded database). Stops what it started, prints `tests: N passed, N failed`, exits non-zero on any
 * failure.
 *
 * Flags: `--no-browser` skips the browser tests; anything after `--` goes to the first vitest run (e.g. a file filter).
 */
import { spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { connect } from '../server/db/client';
import { migrateDatabase, ROOT } from './lib/bootstrap';
import { ensureCluster, ensureDatabase, freePort, stopCluster } from './lib/postgres';
import { buildClient, runBin } from './lib/run';

const TMP = path.join(ROOT, '.tmp');
// KILOWATCH_TEST_TAG gives a run its own cluster folder, so several runs can share one checkout.
const TAG = (process.env.KILOWATCH_TEST_TAG ?? '').replace(/[^a-z0-9-]/gi, '');
const CLUSTER_DIR = path.join(TMP, TAG ? `pg-test-${TAG}` : 'pg-test');
const TEMPLATE_DB = 'kilowatch_template';

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

function readCounts(file: string): Counts {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const report = JSON.parse(readFileSync(file, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
    numFailedTestSuites: number;
  };
  return {
    passed: report.numPassedTests,
    // A file that fails to load has no failed tests but a failed suite; count it so the run cannot look green.
    failed: report.numFailedTests + (report.numFailedTests === 0 ? report.numFailedTestSuites : 0),
    skipped: report.numPendingTests + report.numTodoTests,
  };
}

function ensureChromium(): void {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) {
    throw new Error("Browser tests need Debian's chromium package at /usr/bin/chromium (sudo apt-get install chromium)");
  }
  console.log("[test] installing Debian's chromium package (apt-get)");
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', '--no-install-recommends', 'chromium']]) {
    const res = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (res.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}

async function waitForHealth(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the test server did not answer ${url}/api/health in time`);
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const dashdash = args.indexOf('--');
  const passThrough = dashdash >= 0 ? args.slice(dashdash + 1) : [];
  const browser = !args.includes('--no-browser');
  const totals: Counts = { passed: 0, failed: 0, skipped: 0 };

  if (browser) ensureChromium();
  stopCluster(CLUSTER_DIR);
  rmSync(CLUSTER_DIR, { recursive: true, force: true });
  rmSync(`${CLUSTER_DIR}.secret`, { force: true });
  mkdirSync(TMP, { recursive: true });
  const cluster = await ensureCluster(CLUSTER_DIR, await freePort());
  let server: ReturnType<typeof spawn> | null = null;
  try {
    await ensureDatabase(cluster, TEMPLATE_DB);
    await migrateDatabase(cluster.urlFor(TEMPLATE_DB));
    const env = {
      ...process.env,
      NODE_ENV: 'test',
      KILOWATCH_TEST_ADMIN_URL: cluster.adminUrl,
      KILOWATCH_TEST_TEMPLATE: TEMPLATE_DB,
    };

    const mainReport = path.join(TMP, `vitest-main${TAG ? `-${TAG}` : ''}.json`);
    rmSync(mainReport, { force: true });
    console.log('[test] unit and API integration tests');
    await runBin('vitest', ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${mainReport}`, ...passThrough], { env });
    const main = readCounts(mainReport);
    totals.passed += main.passed;
    totals.failed += main.failed;
    totals.skipped += main.skipped;

    if (browser) {
      await buildClient();
      const e2eDb = 'kilowatch_e2e';
      await ensureDatabase(cluster, e2eDb);
      const url = cluster.urlFor(e2eDb);
      await migrateDatabase(url);
      const { seedDemo } = await import('../seed/index');
      const database = connect(url, 4);
      try {
        await seedDemo(database.db);
      } finally {
        await database.close();
      }
      const port = await freePort();
      server = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
        cwd: ROOT,
        stdio: ['ignore', 'inherit', 'inherit'],
        env: {
          ...env,
          DATABASE_URL: url,
          SESSION_SECRET: randomBytes(48).toString('base64url'),
          KILOWATCH_PORT: String(port),
          KILOWATCH_HOST: '127.0.0.1',
          MAIL_MODE: 'fake',
        },
      });
      const baseUrl = `http://127.0.0.1:${port}`;
      await waitForHealth(baseUrl, 60_000);
      const e2eReport = path.join(TMP, `vitest-e2e${TAG ? `-${TAG}` : ''}.json`);
      rmSync(e2eReport, { force: true });
      console.log('[test] browser tests (playwright-core + Debian chromium)');
      await runBin('vitest', ['run', '--config', 'vitest.e2e.config.ts', '--reporter=default', '--reporter=json', `--outputFile.json=${e2eReport}`], {
        env: { ...env, E2E_BASE_URL: baseUrl },
      });
      const e2e = readCounts(e2eReport);
      totals.passed += e2e.passed;
      totals.failed += e2e.failed;
      totals.skipped += e2e.skipped;
    }
  } finally {
    if (server && server.exitCode === null) {
      const exited = new Promise((resolve) => server!.once('exit', resolve));
      server.kill('SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 10_000))]);
    }
    stopCluster(CLUSTER_DIR);
    rmSync(CLUSTER_DIR, { recursive: true, force: true });
    rmSync(`${CLUSTER_DIR}.secret`, { force: true });
  }
  console.log('');
  console.log(`tests: ${totals.passed} passed, ${totals.failed} failed${totals.skipped ? `, ${totals.skipped} skipped` : ''}`);
  return totals.failed > 0 || totals.passed === 0 ? 1 : 0;
}

main()
  .then((code) => process.exit(code))
  .catch((err: Error) => {
    console.error(err.stack ?? err.message);
    stopCluster(CLUSTER_DIR);
    process.exit(1);
  });
