/**
 * `npm run dev`: the project-local database (as for `npm start`), the API under `tsx watch` on KILOWATCH_PORT
 * (default 3000), and the Vite dev server, which proxies /api to it.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { connect } from '../server/db/client';
import { isDatabaseEmpty, seedDemo } from '../seed/index';
import { demoDatabase, migrateDatabase, ROOT, sessionSecret } from './lib/bootstrap';

async function main(): Promise<void> {
  const { url } = await demoDatabase();
  await migrateDatabase(url);
  const database = connect(url, 4);
  try {
    if (await isDatabaseEmpty(database.db)) await seedDemo(database.db);
  } finally {
    await database.close();
  }
  const env = { ...process.env, DATABASE_URL: url, SESSION_SECRET: sessionSecret(), KILOWATCH_PORT: process.env.KILOWATCH_PORT ?? '3000' };
  const bin = (name: string) => path.join(ROOT, 'node_modules', '.bin', name);
  const api = spawn(bin('tsx'), ['watch', 'server/index.ts'], { cwd: ROOT, stdio: 'inherit', env });
  const vite = spawn(bin('vite'), [], { cwd: ROOT, stdio: 'inherit', env });
  const stop = () => {
    api.kill('SIGTERM');
    vite.kill('SIGTERM');
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: Error) => {
  console.error(err.message);
  process.exit(1);
});
