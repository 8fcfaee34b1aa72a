import { isEmpty, seedDemo } from '../fixtures/seed';
import { migrate, withOrm } from './lib/db';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

const url = process.env.DATABASE_URL ?? (await startCluster(DEMO)).url;
await migrate(url);
await withOrm(url, async (orm) => {
  const em = orm.em.fork();
  if (!(await isEmpty(em))) {
    log('the database already has companies; demo data not loaded (drop the database to start over).');
    return;
  }
  await seedDemo(orm, { outboxDir: '.data/outbox' });
  log('demo data loaded.');
});
