import { randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import {
  Logger,
  run,
  runMigrations,
  runOnce,
  type LogLevel,
  type Runner,
  type RunnerOptions,
  type TaskList,
} from 'graphile-worker';
import pg from 'pg';
import { logger as appLogger } from '../lib/logger';
import {
  TASK_KINDS,
  TASKS,
  type AbandonedHandlers,
  type TaskHandlers,
  type TaskKind,
  type TaskPayload,
} from '../tasks/kinds';

/**
 * Background work on PostgreSQL (graphile-worker, in its own schema `graphile_worker`). Jobs are rows,
 * so a job added inside a request's transaction exists exactly when the request's writes do, and any
 * process connected to the database can run it: the server itself (default) or `npm run worker`.
 */
export interface Queue {
  /** Adds a job; with `em`, inside that EntityManager's transaction (it appears only if the transaction commits). */
  add<K extends TaskKind>(kind: K, payload: TaskPayload<K>, opts?: AddOptions): Promise<void>;
  /** Starts workers in this process. */
  start(): Promise<void>;
  /**
   * Runs every job of this queue that is due until none is left (tests, scripts). `retriesNow` first
   * brings retries waiting out their back-off forward to now.
   */
  drain(opts?: { retriesNow?: boolean; timeoutMs?: number }): Promise<void>;
  /**
   * Gives back the jobs a stopped process left locked (see "A process killed in the middle" below): each
   * one's `abandoned` handler puts its record right, then the job is unlocked for its next try. start() runs
   * it first and then every `sweepIntervalMs`; tests call it directly. Answers how many jobs it released.
   */
  releaseAbandoned(): Promise<number>;
  /** Stops the workers (a job in progress finishes first) and closes the connections. */
  stop(): Promise<void>;
}

export interface AddOptions {
  em?: EntityManager;
  runAt?: Date;
  /** One waiting job per key: adding again replaces it and resets its tries (graphile-worker's job_key). */
  jobKey?: string;
}

export interface QueueOptions {
  databaseUrl: string;
  handlers: TaskHandlers;
  /**
   * Task names are prefixed with it, and a worker takes only the jobs of its own names: two apps on one
   * database (each test file's app, a staging and a review deployment) never run each other's jobs.
   */
  namespace?: string;
  /** Jobs run at once in this process. */
  concurrency?: number;
  /** How often workers look for retries that became due (new jobs arrive by LISTEN/NOTIFY at once). */
  pollIntervalMs?: number;
  /** What each kind does about a try lost with its process (its record would say "in progress" for ever). */
  abandoned?: AbandonedHandlers;
  /** How often a running queue looks for jobs left locked by a process that is gone (default one minute). */
  sweepIntervalMs?: number;
}

/**
 * A process killed in the middle (SIGKILL, out of memory, the machine lost): graphile-worker leaves the
 * job it was running locked, and takes it again only when the lock is 4 hours old (its get_job's
 * job_expiry) — a proposal's PDF would say "rendering" for 4 hours, and for ever when that was its last try.
 * So each process that runs workers holds one connection named `gaugeline-queue:<token>` for as long as
 * it lives, and names its workers `gl:<token>:<n>`. PostgreSQL drops a killed process's connections at
 * once, so a job locked by a `gl:` worker whose token has no connection in pg_stat_activity belongs to a
 * process that is gone: releaseAbandoned runs the kind's `abandoned` handler and unlocks it
 * (graphile_worker.force_unlock_workers). The lost try counts as one of the job's tries. (Every process
 * must connect as the same database role: another role's sessions are visible in pg_stat_activity too,
 * but a role without pg_read_all_stats sees their application_name only for its own.)
 */
const PRESENCE = 'gaugeline-queue:';
const WORKER_PREFIX = 'gl:';

const LEVELS: Record<LogLevel, 'error' | 'warn' | 'info' | 'debug'> = {
  error: 'error',
  warning: 'warn',
  info: 'info',
  debug: 'debug',
};
const workerLogger = new Logger((scope) => (level, message, meta) => {
  appLogger[LEVELS[level]]({ queue: scope.taskIdentifier ?? scope.label, jobId: scope.jobId, ...meta }, message);
});

/** Creates (or brings up to date) graphile-worker's schema; `npm start`, `npm test` and db:migrate call it. */
export async function migrateQueue(databaseUrl: string): Promise<void> {
  await runMigrations({ connectionString: databaseUrl, logger: workerLogger });
}

export function createQueue(opts: QueueOptions): Queue {
  const concurrency = opts.concurrency ?? 2;
  // Each worker (one runner each, so its id can be named) holds a LISTEN connection and takes one for a job.
  const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 2 * concurrency + 2 });
  const token = randomBytes(6).toString('hex');
  pool.on('error', (err) => appLogger.warn({ err }, 'queue connection lost'));
  const identifier = (kind: TaskKind) => (opts.namespace ? `${opts.namespace}:${kind}` : kind);
  const identifiers = TASK_KINDS.map(identifier);

  const taskList: TaskList = {};
  for (const kind of TASK_KINDS) {
    taskList[identifier(kind)] = async (raw, helpers) => {
      const parsed = TASKS[kind].payload.safeParse(raw);
      if (!parsed.success) {
        // Never going to work: say so once, and let the job go instead of retrying it for hours.
        helpers.logger.error(`dropping a ${kind} job with a malformed payload: ${parsed.error.message}`);
        return;
      }
      const run = { jobId: helpers.job.id, attempt: helpers.job.attempts, maxAttempts: helpers.job.max_attempts };
      await opts.handlers[kind](parsed.data as never, run);
    };
  }
  const common = { pgPool: pool, taskList, noHandleSignals: true, logger: workerLogger, parsedCronItems: [] };

  let runners: Runner[] = [];
  let presence: pg.Client | undefined;
  let sweepTimer: NodeJS.Timeout | undefined;
  let stopped = false;

  /** This process's "I am alive" connection; reopened (every second until it works) if it drops while the queue runs. */
  const holdPresence = async (): Promise<void> => {
    const client = new pg.Client({ connectionString: opts.databaseUrl, application_name: `${PRESENCE}${token}` });
    const lost = (err?: unknown) => {
      if (presence !== client || stopped) return;
      appLogger.warn({ err }, 'queue presence connection lost; reconnecting');
      presence = undefined;
      const retry = () => {
        if (stopped) return;
        holdPresence().catch(() => setTimeout(retry, 1000).unref());
      };
      setTimeout(retry, 1000).unref();
    };
    client.on('error', lost);
    client.on('end', () => lost());
    await client.connect();
    presence = client;
  };

  const releaseAbandoned = async (): Promise<number> => {
    const { rows } = await pool.query<{
      id: string;
      task_identifier: string;
      payload: unknown;
      attempts: number;
      max_attempts: number;
      locked_by: string;
    }>(
      // The public view graphile_worker.jobs has no payload: its tables, as in graphile-worker 0.16.
      `select j.id, t.identifier as task_identifier, j.payload, j.attempts, j.max_attempts, j.locked_by
         from graphile_worker._private_jobs j join graphile_worker._private_tasks t on t.id = j.task_id
        where t.identifier = any($1::text[]) and j.locked_by like $2
          and not exists (select 1 from pg_stat_activity a
                           where a.application_name = $3 || split_part(j.locked_by, ':', 2))`,
      [identifiers, `${WORKER_PREFIX}%`, PRESENCE],
    );
    if (rows.length === 0) return 0;
    for (const job of rows) {
      const kind = TASK_KINDS.find((k) => identifier(k) === job.task_identifier);
      const handler = kind && opts.abandoned?.[kind];
      const parsed = kind ? TASKS[kind].payload.safeParse(job.payload) : undefined;
      appLogger.warn(
        { jobId: job.id, task: job.task_identifier, attempt: job.attempts, lockedBy: job.locked_by },
        'releasing a job left locked by a stopped process',
      );
      if (!handler || !parsed?.success) continue;
      try {
        await (handler as (p: unknown, r: { jobId: string; attempt: number; maxAttempts: number }) => Promise<void>)(
          parsed.data,
          { jobId: job.id, attempt: job.attempts, maxAttempts: job.max_attempts },
        );
      } catch (err) {
        // Unlocked all the same: its next try (if any) puts the record right as it runs.
        appLogger.error({ err, jobId: job.id }, 'the abandoned-job handler failed');
      }
    }
    await pool.query('select graphile_worker.force_unlock_workers($1::text[])', [
      [...new Set(rows.map((r) => r.locked_by))],
    ]);
    return rows.length;
  };

  const countWaiting = async (): Promise<number> => {
    const r = await pool.query<{ n: string }>(
      `select count(*) as n from graphile_worker.jobs
        where task_identifier = any($1::text[]) and attempts < max_attempts
          and (locked_at is not null or run_at <= now())`,
      [identifiers],
    );
    return Number(r.rows[0]?.n ?? 0);
  };

  return {
    async add(kind, payload, addOpts = {}) {
      if (stopped) throw new Error('the queue is stopped');
      const checked = TASKS[kind].payload.parse(payload);
      const args = [
        identifier(kind),
        JSON.stringify(checked),
        TASKS[kind].maxAttempts,
        addOpts.runAt?.toISOString() ?? null,
        addOpts.jobKey ?? null,
      ];
      if (addOpts.em) {
        await addOpts.em.execute(
          'select graphile_worker.add_job(?, ?::json, max_attempts => ?, run_at => ?::timestamptz, job_key => ?) as job',
          args,
        );
      } else {
        await pool.query(
          'select graphile_worker.add_job($1, $2::json, max_attempts => $3, run_at => $4::timestamptz, job_key => $5)',
          args,
        );
      }
    },

    async start() {
      if (runners.length || stopped) return;
      await holdPresence();
      await releaseAbandoned();
      const pollInterval = opts.pollIntervalMs ?? 2000;
      for (let i = 0; i < concurrency; i++) {
        // graphile-worker reads workerId from the options it is given (one worker per runner).
        const options: RunnerOptions & { workerId: string } = {
          ...common,
          concurrency: 1,
          pollInterval,
          workerId: `${WORKER_PREFIX}${token}:${i}`,
        };
        runners.push(await run(options));
      }
      sweepTimer = setInterval(() => {
        releaseAbandoned().catch((err: unknown) => appLogger.warn({ err }, 'the abandoned-job sweep failed'));
      }, opts.sweepIntervalMs ?? 60_000);
      sweepTimer.unref();
    },

    releaseAbandoned,

    async drain({ retriesNow = false, timeoutMs = 15_000 } = {}) {
      if (retriesNow) {
        await pool.query(
          `select graphile_worker.reschedule_jobs(array_agg(id), run_at => now())
             from graphile_worker.jobs
            where task_identifier = any($1::text[]) and attempts < max_attempts and locked_at is null`,
          [identifiers],
        );
      }
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        await runOnce(common);
        if ((await countWaiting()) === 0) return;
        if (Date.now() > deadline) throw new Error(`the queue did not drain within ${timeoutMs} ms`);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    },

    async stop() {
      if (stopped) return;
      stopped = true;
      clearInterval(sweepTimer);
      await Promise.all(runners.map((r) => r.stop()));
      runners = [];
      // The presence goes last: until the jobs in hand have finished, this process still holds them.
      await presence?.end().catch(() => undefined);
      presence = undefined;
      await pool.end();
    },
  };
}
