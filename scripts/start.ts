/**
 * `npm start`: the project-local PostgreSQL cluster (created and started as needed), migrations, the demo scenario
 * when the database is empty, a client build, and one Express process serving API and client.
 */
import { connect } from '../server/db/client';
import { DEMO_SIGN_INS, isDatabaseEmpty, seedDemo } from '../seed/index';
import { demoDatabase, migrateDatabase, sessionSecret } from './lib/bootstrap';
import { portIsFree } from './lib/postgres';
import { buildClient } from './lib/run';

async function main(): Promise<void> {
  const { url } = await demoDatabase();
  await migrateDatabase(url);
  const database = connect(url, 4);
  try {
    if (await isDatabaseEmpty(database.db)) {
      console.log('[db] empty database: seeding the demo scenario (invented company, vessels and logs)');
      const started = Date.now();
      await seedDemo(database.db);
      console.log(`[db] demo scenario seeded in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    }
  } finally {
    await database.close();
  }
  if (process.env.KILOWATCH_SKIP_BUILD !== 'true') await buildClient();

  const wanted = Number(process.env.KILOWATCH_PORT ?? 3000);
  if (!(await portIsFree(wanted))) {
    console.log(`[server] port ${wanted} is taken; picking a free one`);
    process.env.KILOWATCH_PORT = '0';
  } else {
    process.env.KILOWATCH_PORT = String(wanted);
  }
  process.env.DATABASE_URL = url;
  process.env.SESSION_SECRET = sessionSecret();
  process.env.NODE_ENV ??= 'production';
  const { startServer } = await import('../server/index');
  const server = await startServer();
  console.log('');
  console.log(`Kilowatch is running at ${server.url}`);
  console.log('Demo sign-ins (invented company; password for all shown beside each):');
  for (const s of DEMO_SIGN_INS) console.log(`  ${s.role.padEnd(15)} ${s.email.padEnd(34)} ${s.password}`);
  console.log('Stop with Ctrl+C (the data stays); `npm run db:stop` stops the database cluster.');
  const stop = () => {
    server.close().then(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: Error) => {
  console.error(err.stack ?? err.message);
  process.exit(1);
});
