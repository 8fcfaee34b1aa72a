import type { EntityManager } from '@mikro-orm/postgresql';
import { Logger, run, runMigrations, runOnce, type LogLevel, type Runner, type TaskList } from 'graphile-worker';
import pg from 'pg';
import { logger as appLogger } from '../lib/logger';
import { TASK_KINDS, TASKS, type TaskHandlers, type TaskKind, type TaskPayload } from '../tasks/kinds';

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
}

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
  const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: concurrency + 2 });
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

  let runner: Runner | undefined;
  let stopped = false;

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
      if (runner || stopped) return;
      runner = await run({ ...common, concurrency, pollInterval: opts.pollIntervalMs ?? 2000 });
    },

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
      await runner?.stop();
      runner = undefined;
      await pool.end();
    },
  };
}
