/**
 * A fresh, migrated database for a benchmark on the throwaway cluster that scripts/bench.ts starts
 * (KILOWATCH_BENCH_ADMIN_URL). Returns null when run outside the bench runner.
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { connect } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';

export async function benchDatabase(prefix: string): Promise<string | null> {
  const admin = process.env.KILOWATCH_BENCH_ADMIN_URL;
  if (!admin) return null;
  const name = `${prefix}_${randomBytes(4).toString('hex')}`;
  const client = new pg.Client({ connectionString: admin });
  await client.connect();
  await client.query(`create database ${name}`);
  await client.end();
  const url = new URL(admin);
  url.pathname = `/${name}`;
  const database = connect(url.toString(), 2);
  await runMigrations(database.db);
  await database.close();
  return url.toString();
}
