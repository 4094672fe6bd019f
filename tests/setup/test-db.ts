/**
 * A database of its own for one integration test file, copied from the migrated template that scripts/test.ts
 * prepared in the throwaway cluster. Dropped again by close().
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { connect, type Database } from '../../server/db/client';

export interface TestDatabase extends Database {
  url: string;
  name: string;
}

function adminUrl(): string {
  const url = process.env.KILOWATCH_TEST_ADMIN_URL;
  if (!url) throw new Error('Integration tests run through `npm test`, which starts their PostgreSQL (KILOWATCH_TEST_ADMIN_URL is unset)');
  return url;
}

async function admin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl() });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const template = process.env.KILOWATCH_TEST_TEMPLATE ?? 'kilowatch_template';
  const name = `t_${randomBytes(6).toString('hex')}`;
  await admin(async (client) => {
    for (let attempt = 0; ; attempt++) {
      try {
        await client.query(`create database ${name} template ${template}`);
        return;
      } catch (err) {
        // Two files copying the template at the same moment can collide; wait and retry.
        if (attempt >= 20 || !/being accessed by other users/.test(String(err))) throw err;
        await new Promise((r) => setTimeout(r, 100 + 50 * attempt));
      }
    }
  });
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  const database = connect(url.toString(), 5);
  return {
    ...database,
    url: url.toString(),
    name,
    async close() {
      await database.close();
      await admin((client) => client.query(`drop database if exists ${name} with (force)`));
    },
  };
}
