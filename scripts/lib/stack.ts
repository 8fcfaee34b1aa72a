import { Cluster } from './postgres';

/** Where each purpose's cluster lives. Demo data and tests never share a cluster or a database. */
export const DEMO = {
  dataDir: '.data/pg',
  port: Number(process.env.GAUGELINE_DEMO_PORT ?? 54328),
  database: 'gaugeline',
  role: 'gaugeline',
  password: 'gaugeline-local',
} as const;
// GAUGELINE_TEST_DB lets two test runs share the cluster without sharing a database.
export const TEST = {
  dataDir: '.data/pg-test',
  port: Number(process.env.GAUGELINE_TEST_PORT ?? 54329),
  database: process.env.GAUGELINE_TEST_DB ?? 'gaugeline_test',
  role: 'gaugeline',
  password: 'gaugeline-local',
} as const;

export async function startCluster(
  which: { dataDir: string; port: number; database: string; role: string; password: string },
  opts: { fast?: boolean; recreate?: boolean } = {},
) {
  const cluster = new Cluster({ dataDir: which.dataDir, port: which.port, fast: opts.fast });
  const startedHere = cluster.start();
  const url = await cluster.ensureDatabase(which.database, which.role, which.password, { recreate: opts.recreate });
  return { cluster, url, startedHere };
}
