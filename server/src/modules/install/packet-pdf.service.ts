import { createHash, randomUUID } from 'node:crypto';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import type { InstallPacket } from '@contract';
import { ConflictError } from '../../lib/errors';
import { logger } from '../../lib/logger';
import type { ServiceContext } from '../../lib/service-context';
import type { Clock, Services } from '../../services/services';
import type { Storage } from '../../services/storage';
import type { TaskPayload, TaskRun } from '../../tasks/kinds';
import { assertInstallerMayOpen } from './assignment';
import { composePacket, packetPdfState, packetSource } from './packet.service';

/**
 * The packet's PDF through the job queue (issue 15), in the proposal PDF's pattern: asking adds a
 * `render-install-packet` task in the same transaction that marks the row 'waiting'; the task renders from
 * the signed option (and the rooms' notes as they are then), stores the bytes and records the SHA-256. Asking
 * again (the notes changed) bumps `request_seq`: an older try that finishes late records nothing.
 */

type Payload = TaskPayload<'render-install-packet'>;

export interface PacketPdfDeps {
  readonly orm: MikroORM;
  readonly storage: Storage;
  readonly clock: Clock;
}

const storageKey = (jobId: string, seq: number) => `install-packet-${jobId}-${seq}`;

/** POST /api/jobs/:jobId/packet/pdf: (re)makes the PDF; 404 outside the actor's scope, 409 with no signed option. */
export async function requestPacketPdf(
  ctx: ServiceContext & { queue: Services['queue'] },
  jobId: string,
): Promise<InstallPacket['pdf']> {
  const job = await assertInstallerMayOpen(ctx.em, ctx.actor, jobId);
  const src = await packetSource(ctx.em, job.companyId, job.id);
  await ctx.em.transactional(async (tx) => {
    const [row] = await tx.execute<{ request_seq: number }[]>(
      `insert into "install_packet_pdf" ("id", "company_id", "job_id", "version_id", "state", "request_seq", "requested_at")
       values (?, ?, ?, ?, 'waiting', 1, ?)
       on conflict ("job_id") do update set "state" = 'waiting', "request_seq" = "install_packet_pdf"."request_seq" + 1,
         "version_id" = excluded."version_id", "sha256" = null, "storage_key" = null, "failure" = null,
         "requested_at" = excluded."requested_at", "made_at" = null
       returning "request_seq"`,
      [randomUUID(), job.companyId, job.id, src.sold.versionId, ctx.clock.now()],
    );
    await ctx.queue.add(
      'render-install-packet',
      { companyId: job.companyId, jobId: job.id, requestSeq: Number(row!.request_seq) },
      { em: tx, jobKey: `install-packet:${job.id}` },
    );
  });
  return packetPdfState(ctx.em, job.companyId, job.id);
}

async function setState(em: EntityManager, p: Payload, state: 'waiting' | 'rendering') {
  await em.execute(
    `update "install_packet_pdf" set "state" = ? where "job_id" = ? and "company_id" = ? and "request_seq" = ?
       and "state" in ('waiting', 'rendering')`,
    [state, p.jobId, p.companyId, p.requestSeq],
  );
}

async function afterTry(em: EntityManager, p: Payload, run: TaskRun, reason: string) {
  if (run.attempt < run.maxAttempts) return setState(em, p, 'waiting');
  await em.execute(
    `update "install_packet_pdf" set "state" = 'failed', "failure" = ? where "job_id" = ? and "company_id" = ?
       and "request_seq" = ? and "state" in ('waiting', 'rendering')`,
    [reason.slice(0, 300), p.jobId, p.companyId, p.requestSeq],
  );
}

/** The task's handler. */
export async function renderPacketPdf(deps: PacketPdfDeps, p: Payload, run: TaskRun): Promise<void> {
  const em = deps.orm.em.fork();
  const [row] = await em.execute<{ request_seq: number; state: string }[]>(
    'select "request_seq", "state" from "install_packet_pdf" where "job_id" = ? and "company_id" = ?',
    [p.jobId, p.companyId],
  );
  if (!row || Number(row.request_seq) !== p.requestSeq || row.state === 'ready' || row.state === 'failed') {
    logger.debug({ jobId: p.jobId }, 'render-install-packet: superseded or done; skipped');
    return;
  }
  await setState(em, p, 'rendering');
  try {
    const src = await packetSource(em, p.companyId, p.jobId);
    const packet = composePacket(src.job, src.sold, src.rooms, { state: 'rendering', sha256: null });
    const { renderPacketPdf: render } = await import('./pdf/render-packet');
    const bytes = await render(packet);
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const key = storageKey(p.jobId, p.requestSeq);
    await deps.storage.put(key, bytes, 'application/pdf');
    await em.execute(
      `update "install_packet_pdf" set "state" = 'ready', "sha256" = ?, "storage_key" = ?, "made_at" = ?
        where "job_id" = ? and "company_id" = ? and "request_seq" = ? and "state" <> 'ready'`,
      [sha256, key, deps.clock.now(), p.jobId, p.companyId, p.requestSeq],
    );
  } catch (err) {
    const reason = err instanceof Error ? err.message : 'unknown error';
    await afterTry(deps.orm.em.fork(), p, run, reason);
    // No signed option any more (cancelled meanwhile): nothing to retry.
    if (err instanceof ConflictError) return;
    throw err;
  }
}

/** A try lost with its process: back to 'waiting', or 'failed' after the last try. */
export async function renderPacketAbandoned(deps: Pick<PacketPdfDeps, 'orm'>, p: Payload, run: TaskRun): Promise<void> {
  await afterTry(deps.orm.em.fork(), p, run, 'The process making the PDF stopped.');
}

/** The stored bytes for GET …/packet/pdf; 409 until made. */
export async function packetPdfBytes(
  ctx: ServiceContext & { storage: Storage },
  jobId: string,
): Promise<{ bytes: Buffer; sha256: string; fileName: string }> {
  const job = await assertInstallerMayOpen(ctx.em, ctx.actor, jobId);
  const [row] = await ctx.em.execute<{ state: string; sha256: string | null; storage_key: string | null }[]>(
    'select "state", "sha256", "storage_key" from "install_packet_pdf" where "company_id" = ? and "job_id" = ?',
    [job.companyId, job.id],
  );
  if (!row || row.state !== 'ready' || !row.storage_key || !row.sha256)
    throw new ConflictError(
      row?.state === 'failed'
        ? 'The packet’s PDF could not be made. Ask for it again.'
        : 'The packet’s PDF is not made yet.',
    );
  const bytes = await ctx.storage.get(row.storage_key);
  if (!bytes) throw new ConflictError('The packet’s PDF is not stored any more. Ask for it again.');
  return { bytes, sha256: row.sha256, fileName: `job-packet-${job.id.slice(0, 8)}.pdf` };
}
