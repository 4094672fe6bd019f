/**
 * The set-up both `npm start` and `npm test` do: a project-local PostgreSQL cluster, a database, the committed
 * migrations, and (for start) the demo scenario when the database is empty.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { connect } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { ensureCluster, ensureDatabase, type Cluster } from './postgres';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
/** Ignored by git: the demo cluster, its password, the session secret. */
export const DATA_DIR = path.join(ROOT, '.data');
export const DEMO_CLUSTER_DIR = path.join(DATA_DIR, 'pg');

export function demoPgPort(): number {
  const raw = process.env.KILOWATCH_PG_PORT ?? '54329';
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`KILOWATCH_PG_PORT must be a port number, not ${raw}`);
  return port;
}

export async function migrateDatabase(url: string): Promise<void> {
  const database = connect(url, 2);
  try {
    await runMigrations(database.db);
  } finally {
    await database.close();
  }
}

/** The demo database URL: DATABASE_URL when set, else the project-local cluster (created and started as needed). */
export async function demoDatabase(): Promise<{ url: string; cluster: Cluster | null }> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, cluster: null };
  const cluster = await ensureCluster(DEMO_CLUSTER_DIR, demoPgPort());
  const name = process.env.KILOWATCH_DB_NAME ?? 'kilowatch';
  if (await ensureDatabase(cluster, name)) console.log(`[db] created database ${name}`);
  return { url: cluster.urlFor(name), cluster };
}

/** A session secret kept in .data so sessions survive restarts; SESSION_SECRET wins when set. */
export function sessionSecret(): string {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  const file = path.join(DATA_DIR, 'session-secret');
  if (!existsSync(file)) {
    mkdirSync(DATA_DIR, { recursive: true });
    writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 });
  }
  return readFileSync(file, 'utf8').trim();
}
