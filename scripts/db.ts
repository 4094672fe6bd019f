/**
 * `npm run db:migrate`, `npm run db:seed`, `npm run db:stop`: the demo database's chores.
 * They act on DATABASE_URL when it is set, otherwise on the project-local cluster in .data/pg.
 */
import { connect } from '../server/db/client';
import { seedDemo, isDatabaseEmpty } from '../seed/index';
import { demoDatabase, DEMO_CLUSTER_DIR, migrateDatabase } from './lib/bootstrap';
import { stopCluster } from './lib/postgres';

const command = process.argv[2];

async function main(): Promise<void> {
  if (command === 'stop') {
    if (!stopCluster(DEMO_CLUSTER_DIR)) console.log('[db] the project-local cluster is not running');
    return;
  }
  const { url } = await demoDatabase();
  if (command === 'migrate') {
    await migrateDatabase(url);
    console.log('[db] migrations applied');
    return;
  }
  if (command === 'seed') {
    await migrateDatabase(url);
    const database = connect(url, 4);
    try {
      if (!(await isDatabaseEmpty(database.db))) {
        console.log('[db] the database holds data already; the demo scenario is seeded only into an empty one');
        return;
      }
      await seedDemo(database.db);
      console.log('[db] demo scenario seeded');
    } finally {
      await database.close();
    }
    return;
  }
  throw new Error('usage: tsx scripts/db.ts migrate|seed|stop');
}

main().catch((err: Error) => {
  console.error(err.message);
  process.exit(1);
});
