import { withOrm } from './lib/db';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

// Writes a new migration from the difference between the entities and the demo database's schema.
const url = process.env.DATABASE_URL ?? (await startCluster(DEMO)).url;
await withOrm(url, async (orm) => {
  const name = process.argv[2];
  const r = await orm.getMigrator().createMigration('migrations', false, false, name);
  log(r.fileName ? `created migrations/${r.fileName} — read it before committing` : 'no schema changes found.');
});
