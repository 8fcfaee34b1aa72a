import { migrate } from './lib/db';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

// Migrates the database in DATABASE_URL, or the local demo cluster when none is given.
const url = process.env.DATABASE_URL ?? (await startCluster(DEMO)).url;
await migrate(url);
log('migrations are up to date.');
