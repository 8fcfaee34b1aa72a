import { z } from 'zod';

/**
 * Every kind of background work, in one place: its payload schema (checked when a job is added and
 * again when a worker takes it, so a job written by an older server cannot reach a handler malformed)
 * and how often it is tried before it counts as failed. Handlers live in `tasks/handlers.ts`.
 *
 * Tries back off exponentially (graphile-worker: the n-th retry waits e^min(n,10) seconds, so
 * 3 s, 7 s, 20 s, 55 s, 2.5 min, 7 min, 18 min, 50 min, 2.3 h): ten tries span about 9.7 hours.
 */
export const TASKS = {
  /** Sends one `outgoing_message` row (modules/mail). */
  'send-email': {
    payload: z.strictObject({ messageId: z.uuid() }),
    maxAttempts: 10,
  },
  /** Renders a proposal version's PDF from its frozen snapshot and records its SHA-256 (modules/proposals). */
  'render-proposal-pdf': {
    payload: z.strictObject({ versionId: z.uuid() }),
    maxAttempts: 5,
  },
  /** Refunds the deposit of a cancelled proposal version, if it was paid (modules/cancellations). */
  'refund-deposit': {
    payload: z.strictObject({ paymentId: z.uuid() }),
    maxAttempts: 10,
  },
  /** Makes a signed proposal's sealed copy (signature, signing record, PDF seal), stores and e-mails it (modules/signing). */
  'seal-signed-proposal': {
    payload: z.strictObject({ signatureId: z.uuid() }),
    maxAttempts: 10,
  },
  /** Renders a won job's packet PDF for its installers from the signed option, no prices (modules/install). */
  'render-install-packet': {
    payload: z.strictObject({ companyId: z.uuid(), jobId: z.uuid(), requestSeq: z.number().int().positive() }),
    maxAttempts: 5,
  },
} as const;

export type TaskKind = keyof typeof TASKS;
export const TASK_KINDS = Object.keys(TASKS) as TaskKind[];
export type TaskPayload<K extends TaskKind> = z.infer<(typeof TASKS)[K]['payload']>;

/** What a handler learns about the try it is in. */
export interface TaskRun {
  jobId: string;
  /** This try's number, from 1. */
  attempt: number;
  maxAttempts: number;
}

export type TaskHandlers = { [K in TaskKind]: (payload: TaskPayload<K>, run: TaskRun) => Promise<void> };

/**
 * A try lost with its process (services/queue.ts releaseAbandoned): the handler never got to write how the
 * try ended, so this puts the record right — `run.attempt < run.maxAttempts`: the job runs again next;
 * otherwise it had no tries left and will not run again.
 */
export type AbandonedHandlers = { [K in TaskKind]?: (payload: TaskPayload<K>, run: TaskRun) => Promise<void> };
