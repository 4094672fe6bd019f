/**
 * Log intake throughput: a generated 100 000-row CSV through the HTTP commit endpoint (multer upload, papaparse,
 * mapping, checks against stored rows, and in one transaction COPY into a temporary table, one INSERT ... SELECT ...
 * ON CONFLICT and the undo records) to committed rows, beside PostgreSQL COPY of the same rows into a scratch table
 * of the same shape, indexes and foreign keys, measured in the same run.
 *
 * Prints `bench intake_rows_per_s <value> rows/s` and `bench intake_vs_copy_ratio <value> x` (our time over COPY's).
 * Run alone: `npx tsx bench/intake.ts` (starts a cluster in .tmp/pg-bench-intake); `npm run bench` gives it the
 * bench cluster through KILOWATCH_BENCH_ADMIN_URL.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { pathToFileURL } from 'node:url';
import argon2 from 'argon2';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { createRng } from '../optimizer/random';
import { createApp } from '../server/app';
import type { AppDeps } from '../server/context';
import { connect } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { busSections, companies, fuelLots, gensets, memberships, users, vessels } from '../server/db/schema';
import { createMailer } from '../server/mail/mailer';
import { dateOfDayNumber, dayNumber } from '../optimizer/index';

const ROWS = 100_000;
const SETS = 12;
const PASSWORD = 'bench password long enough';

export async function main(ctx: { adminUrl: string }): Promise<void> {
  const name = `bench_intake_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: ctx.adminUrl });
  await admin.connect();
  await admin.query(`create database ${name}`);
  const url = new URL(ctx.adminUrl);
  url.pathname = `/${name}`;
  const database = connect(url.toString(), 10);
  let server: Server | null = null;
  try {
    const db = database.db;
    await runMigrations(db);
    const [company] = await db.insert(companies).values({ name: 'Bench Shipping' }).returning();
    const [user] = await db.insert(users).values({ email: 'super@bench.example', name: 'Bench Super', passwordHash: await argon2.hash(PASSWORD, { type: argon2.argon2id }) }).returning();
    await db.insert(memberships).values({ userId: user.id, companyId: company.id, role: 'superintendent' });
    const [vessel] = await db.insert(vessels).values({ companyId: company.id, name: 'Bench Star', imoNumber: '9000001', vesselType: 'container ship', fuelGrades: ['MGO'] }).returning();
    const [section] = await db.insert(busSections).values({ vesselId: vessel.id, name: 'A' }).returning();
    const shop = { p25: 230, p50: 210, p75: 200, p85: 199, p100: 202 };
    const sets = await db
      .insert(gensets)
      .values(
        Array.from({ length: SETS }, (_, i) => ({
          vesselId: vessel.id,
          busSectionId: section.id,
          designation: `DG${i + 1}`,
          ratedKw: 1000,
          ratedKva: 1250,
          voltageV: 440,
          frequencyHz: 60,
          speedClass: 'medium' as const,
          minLoadPct: 30,
          maxLoadPct: 90,
          shopTestSfoc: shop,
        })),
      )
      .returning();
    const [lot] = await db.insert(fuelLots).values({ vesselId: vessel.id, reference: 'BDN-B', grade: 'MGO', density15KgPerM3: 850, lcvMjPerKg: 42.7, deliveredOn: '1999-12-01' }).returning();

    // The file: one row per set and day, cumulative meters, fuel volume with temperature (seeded).
    const rng = createRng(20_240_601);
    const lines = ['date,genset,running_hours_meter_h,kwh_meter_kwh,fuel_volume_l,fuel_temp_c,fuel_lot'];
    const copyRows: string[] = [];
    const start = dayNumber('2000-01-01');
    const days = Math.ceil(ROWS / SETS);
    let n = 0;
    for (let s = 0; s < SETS && n < ROWS; s++) {
      let hours = 10_000;
      let kwh = 5_000_000;
      for (let d = 0; d < days && n < ROWS; d++, n++) {
        const run = 12 + 12 * rng.uniform();
        const produced = run * (350 + 500 * rng.uniform());
        hours += run;
        kwh += produced;
        const litres = (produced * 0.215) / 0.85 / 0.98;
        const date = dateOfDayNumber(start + d);
        const row = [date, sets[s].designation, hours.toFixed(2), kwh.toFixed(1), litres.toFixed(1), '45', 'BDN-B'];
        lines.push(row.join(','));
        copyRows.push([sets[s].id, date, hours.toFixed(2), kwh.toFixed(1), litres.toFixed(1), '45', lot.id, 'import'].join(','));
      }
    }
    const csv = Buffer.from(lines.join('\n'));
    const sha = createHash('sha256').update(csv).digest('hex');
    const mapping = {
      columns: {
        date: { field: 'date' },
        genset: { field: 'genset' },
        running_hours_meter_h: { field: 'runningHoursMeter', unit: 'h' },
        kwh_meter_kwh: { field: 'kwhMeter', unit: 'kWh' },
        fuel_volume_l: { field: 'fuelVolume', unit: 'L' },
        fuel_temp_c: { field: 'fuelTemp', unit: 'C' },
        fuel_lot: { field: 'fuelLot' },
      },
      dateFormat: 'yyyy-mm-dd',
      decimalSeparator: '.',
    };

    const mailer = createMailer({ host: '127.0.0.1', port: 9, secure: false, from: 'bench <bench@kilowatch.invalid>' });
    const deps: AppDeps = {
      db,
      mailer,
      config: { sessionSecret: new TextEncoder().encode('bench-secret-that-is-long-enough-for-hs256'), sessionHours: 12, cookieSecure: false },
      now: () => new Date(),
    };
    const app = createApp(deps);
    server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const address = server.address();
    const base = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base },
      body: JSON.stringify({ email: 'super@bench.example', password: PASSWORD }),
    });
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    if (!cookie) throw new Error(`bench sign-in failed (${signIn.status})`);

    const form = new FormData();
    form.append('file', new Blob([csv]), 'bench.csv');
    form.append('options', JSON.stringify({ mapping, overwriteChanged: false, fileSha256: sha }));
    const t0 = performance.now();
    const res = await fetch(`${base}/api/vessels/${vessel.id}/logs/commit`, { method: 'POST', headers: { origin: base, cookie }, body: form });
    const body = (await res.json()) as { rowsNew?: number; error?: { message: string } };
    const intakeMs = performance.now() - t0;
    if (res.status !== 201 || body.rowsNew !== ROWS) throw new Error(`bench commit failed (${res.status}): ${JSON.stringify(body).slice(0, 500)}`);
    const [{ count }] = (await database.pool.query('select count(*)::int as count from genset_daily_logs')).rows as { count: number }[];
    if (count !== ROWS) throw new Error(`bench committed ${count} rows, expected ${ROWS}`);

    // Reference: COPY of the same rows into a scratch table of the same shape.
    // Same columns, defaults and indexes (LIKE ... INCLUDING ALL), plus the same two foreign keys LIKE leaves out.
    await database.pool.query('create table scratch_logs (like genset_daily_logs including all)');
    await database.pool.query('alter table scratch_logs add foreign key (genset_id) references gensets(id), add foreign key (fuel_lot_id) references fuel_lots(id)');
    const client = await database.pool.connect();
    let copyMs: number;
    try {
      const t1 = performance.now();
      const stream = client.query(copyFrom('copy scratch_logs (genset_id, log_date, running_hours_meter, kwh_meter, fuel_volume_l, fuel_temp_c, fuel_lot_id, source) from stdin with (format csv)'));
      await pipeline(Readable.from([copyRows.join('\n') + '\n']), stream);
      copyMs = performance.now() - t1;
    } finally {
      client.release();
    }
    console.log(`bench intake_rows_per_s ${Math.round(ROWS / (intakeMs / 1000))} rows/s`);
    console.log(`bench intake_copy_rows_per_s ${Math.round(ROWS / (copyMs / 1000))} rows/s`);
    console.log(`bench intake_vs_copy_ratio ${(intakeMs / copyMs).toFixed(2)} x`);
    mailer.close();
  } finally {
    if (server) await new Promise<void>((resolve) => (server as Server).close(() => resolve()));
    database.pool.on('error', () => undefined);
    await database.close();
    await admin.query(`drop database if exists ${name} with (force)`);
    await admin.end();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  (async () => {
    const given = process.env.KILOWATCH_BENCH_ADMIN_URL;
    if (given) return main({ adminUrl: given });
    const { ensureCluster, freePort, stopCluster } = await import('../scripts/lib/postgres');
    const { ROOT } = await import('../scripts/lib/bootstrap');
    const dir = path.join(ROOT, '.tmp', 'pg-bench-intake');
    const cluster = await ensureCluster(dir, await freePort());
    try {
      return await main({ adminUrl: cluster.adminUrl });
    } finally {
      stopCluster(dir);
    }
  })()
    .then(() => process.exit(0))
    .catch((err: Error) => {
      console.error(err.stack ?? err.message);
      process.exit(1);
    });
}
