import { createHash } from 'node:crypto';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import { proposalSnapshot, type PdfState } from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import { logger } from '../../lib/logger';
import { testPause } from '../../lib/test-pause';
import type { ServiceContext } from '../../lib/service-context';
import type { Queue } from '../../services/queue';
import type { Clock } from '../../services/services';
import type { Storage } from '../../services/storage';
import type { TaskRun } from '../../tasks/kinds';
import { findJob } from '../jobs/job-access';
import { loadLogo } from './pdf/logo';
import { ProposalEventSchema, ProposalVersionSchema } from './proposal.entity';

/**
 * A version's PDF (issue 14): rendered in the background from the frozen snapshot by the queue's
 * `render-proposal-pdf` task, stored through services/storage, its SHA-256 recorded on the version. The
 * database lets the PDF columns change only while pdf_sha256 is NULL, so a PDF, once recorded, stays.
 */

/** One waiting render per version: adding it again (a retry from the screen) replaces the waiting one. */
const jobKey = (versionId: string) => `proposal-pdf:${versionId}`;
/** The storage key: one per version, so a try that stored the bytes but died before recording them is overwritten. */
export const pdfStorageKey = (versionId: string) => `proposal-pdf-${versionId}`;

/** Queues the render of a version's PDF, inside the caller's transaction when given one (issuing does). */
export async function queuePdfRender(queue: Queue, versionId: string, em?: EntityManager): Promise<void> {
  await queue.add('render-proposal-pdf', { versionId }, { jobKey: jobKey(versionId), ...(em ? { em } : {}) });
}

export interface RenderDeps {
  readonly orm: MikroORM;
  readonly storage: Storage;
  readonly clock: Clock;
}

const setState = (em: EntityManager, versionId: string, state: PdfState) =>
  em.execute(
    'update "proposal_version" set "pdf_state" = ? where "id" = ? and "pdf_sha256" is null',
    [state, versionId],
    'run',
  );

/**
 * One try of the task. A version whose PDF is already recorded is left alone (a job that runs twice
 * renders once). While trying it reads 'rendering'; a failed try puts it back to 'waiting' for the queue's
 * next try, and the last failed try marks it 'failed' with an audit event; the error goes back to the
 * queue either way, so it is retried with back-off.
 */
export async function renderVersionPdf(deps: RenderDeps, versionId: string, run: TaskRun): Promise<void> {
  const em = deps.orm.em.fork();
  const version = await em.findOne(ProposalVersionSchema, { id: versionId });
  if (!version) {
    logger.warn({ versionId }, 'render-proposal-pdf: no such version; dropped');
    return;
  }
  if (version.pdfSha256) return;
  await setState(em, versionId, 'rendering');
  // The fault test kills the process here: the version says 'rendering', nothing is stored (lib/test-pause.ts).
  await testPause('render-pdf', async () => ({ versionId }));
  try {
    const snapshot = proposalSnapshot.parse(version.snapshot);
    const logo = await loadLogo(deps.storage, snapshot.company.logoKey);
    // Loaded on the first render, not at start: @react-pdf and the document cost every process that starts
    // the app about a second of CPU (the API, each test app), most of which never render a PDF.
    const { renderProposalPdf } = await import('./pdf/render-proposal');
    const bytes = await renderProposalPdf({ snapshot, versionNumber: version.number, logo });
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const key = pdfStorageKey(versionId);
    await deps.storage.put(key, bytes, 'application/pdf');
    await em.transactional(async (tx) => {
      const n = await tx.execute<{ affectedRows?: number }>(
        `update "proposal_version" set "pdf_state" = 'ready', "pdf_sha256" = ?, "pdf_key" = ?
          where "id" = ? and "pdf_sha256" is null`,
        [sha256, key, versionId],
        'run',
      );
      if (n.affectedRows !== 1) return; // another try recorded it first
      tx.create(ProposalEventSchema, {
        company: version.company,
        proposal: version.proposal,
        version,
        kind: 'pdf-ready',
        at: deps.clock.now(),
        data: { sha256, bytes: bytes.length, attempt: run.attempt },
      });
    });
  } catch (err) {
    const reason = err instanceof Error ? err.message.slice(0, 300) : 'unknown error';
    // A fresh EntityManager: the try's may hold a half-done unit of work.
    await afterTry(deps, deps.orm.em.fork(), versionId, run, reason);
    throw err;
  }
}

/**
 * How a try that did not record a PDF leaves the version: 'waiting' for the queue's next try, or after the
 * last one 'failed' with a pdf-failed event (written once, whoever gets here first).
 */
async function afterTry(
  deps: Pick<RenderDeps, 'clock'>,
  em: EntityManager,
  versionId: string,
  run: TaskRun,
  reason: string,
) {
  if (run.attempt < run.maxAttempts) return setState(em, versionId, 'waiting');
  await em.transactional(async (tx) => {
    const n = await tx.execute<{ affectedRows?: number }>(
      `update "proposal_version" set "pdf_state" = 'failed'
        where "id" = ? and "pdf_sha256" is null and "pdf_state" <> 'failed'`,
      [versionId],
      'run',
    );
    if (n.affectedRows !== 1) return;
    const version = await tx.findOneOrFail(ProposalVersionSchema, { id: versionId });
    tx.create(ProposalEventSchema, {
      company: version.company,
      proposal: version.proposal,
      version,
      kind: 'pdf-failed',
      at: deps.clock.now(),
      data: { reason, attempts: run.attempt },
    });
  });
}

/**
 * A try lost with its process (the queue's releaseAbandoned): the version says 'rendering' and nothing will
 * change it, so it goes back to 'waiting' for the next try, or, when that was the last, to 'failed'.
 */
export async function renderAbandoned(deps: Pick<RenderDeps, 'orm' | 'clock'>, versionId: string, run: TaskRun) {
  const em = deps.orm.em.fork();
  if (!(await em.findOne(ProposalVersionSchema, { id: versionId }))) return;
  await afterTry(deps, em, versionId, run, 'The process making the PDF stopped during its last try.');
}

/** The version of one of the actor's jobs by number, with what the PDF route needs; 404 otherwise. */
async function findVersion(ctx: ServiceContext, jobId: string, number: number) {
  const job = await findJob(ctx, jobId);
  const version = await ctx.em.findOne(ProposalVersionSchema, {
    company: ctx.actor.companyId,
    proposal: { job: job.id },
    number,
  });
  if (!version) throw new NotFoundError('The proposal version');
  return version;
}

/** A file name any system accepts: "proposal-pat-quinlan-v2.pdf" (ASCII letters, digits and hyphens). */
export function pdfFileName(customerName: string, number: number): string {
  const slug = customerName
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/g, '');
  return `proposal-${slug === '' ? 'customer' : slug}-v${number}.pdf`;
}

/** The stored PDF of a version; 409 while it is being prepared or after it failed (the screen says which). */
export async function versionPdf(
  ctx: ServiceContext & { storage: Storage },
  jobId: string,
  number: number,
): Promise<{ bytes: Buffer; fileName: string; sha256: string }> {
  const version = await findVersion(ctx, jobId, number);
  if (version.pdfState !== 'ready' || !version.pdfKey || !version.pdfSha256)
    throw new ConflictError(
      version.pdfState === 'failed'
        ? 'The PDF of this version could not be made. Try again from the proposal screen.'
        : 'The PDF of this version is still being prepared.',
      { pdfState: version.pdfState },
    );
  const bytes = await ctx.storage.get(version.pdfKey);
  if (bytes === null) throw new NotFoundError('The PDF file');
  const snapshot = proposalSnapshot.parse(version.snapshot);
  return { bytes, fileName: pdfFileName(snapshot.customer.name, version.number), sha256: version.pdfSha256 };
}

/**
 * The office's "Try again" for a version whose PDF failed after the queue's last try: back to 'waiting' and
 * queued again, in one transaction (the PDF columns may change while no hash is recorded). A version whose PDF
 * is ready or still on its way is a 409 that says which.
 */
export async function retryPdfRender(
  ctx: ServiceContext & { queue: Queue },
  jobId: string,
  number: number,
): Promise<void> {
  const version = await findVersion(ctx, jobId, number);
  if (version.pdfState !== 'failed')
    throw new ConflictError(
      version.pdfState === 'ready'
        ? 'The PDF of this version is ready; there is nothing to try again.'
        : 'The PDF of this version is already being prepared.',
      { pdfState: version.pdfState },
    );
  await ctx.em.transactional(async (tx) => {
    await tx.execute(
      `update "proposal_version" set "pdf_state" = 'waiting' where "id" = ? and "pdf_state" = 'failed' and "pdf_sha256" is null`,
      [version.id],
      'run',
    );
    await queuePdfRender(ctx.queue, version.id, tx);
  });
}
