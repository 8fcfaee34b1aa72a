import { DELETABLE_JOB_STATUSES, mayDeleteJob, type JobStatus } from '@contract';
import { ConflictError, ForbiddenError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Storage } from '../../services/storage';
import { PhotoSchema } from '../photos/photo.entity';
import { ProposalSchema } from '../proposals/proposal.entity';
import { RoomSchema } from '../rooms/room.entity';
import { findJob } from './job-access';
import { JobSchema } from './job.entity';
import { jobViewOf, presentJob } from './job.presenter';
import { assertVersion } from '../../lib/version-lock';

/** Deleting a job also removes its photos' files. */
export interface JobDeleteContext extends ServiceContext {
  readonly storage: Storage;
}

function notDeletable(status: JobStatus): ConflictError {
  const instead = status === 'proposed' ? 'mark it lost instead' : 'won, lost and installed jobs stay for the reports';
  return new ConflictError(
    `Only a job still in walk-through or design can be deleted (this one is ${status}); ${instead}.`,
  );
}

/**
 * Deletes a job with its rooms and photos; the customer stays (they may have other jobs).
 * Who may: the contract's mayDeleteJob (the policy keeps installers out, and findJob's scope leaves a
 * salesperson only their own jobs, so its check is a second line).
 * Photos, then rooms, then the job, so a photo upload racing this waits on its room instead of
 * deadlocking on the job row; the job goes only at the version the person saw.
 */
export async function deleteJob(ctx: JobDeleteContext, id: string, version: number): Promise<void> {
  const { em, actor, storage } = ctx;
  const keys = await em.transactional(async (tx) => {
    const job = await findJob({ ...ctx, em: tx }, id);
    const hasProposal = (await tx.count(ProposalSchema, { job: job.id, company: actor.companyId })) > 0;
    assertVersion(version, job.version, 'The job', () => presentJob(jobViewOf(job, { hasProposal })));
    if (!DELETABLE_JOB_STATUSES.includes(job.status)) throw notDeletable(job.status);
    if (!mayDeleteJob({ id: actor.userId, role: actor.role }, job)) throw new ForbiddenError();
    // An issued proposal is kept forever (its versions are frozen in PostgreSQL), and so is its job.
    if (hasProposal) throw new ConflictError('A job with an issued proposal cannot be deleted; mark it lost instead.');
    const photos = await tx.find(PhotoSchema, { room: { job: job.id } });
    if (photos.length) await tx.nativeDelete(PhotoSchema, { id: { $in: photos.map((p) => p.id) } });
    await tx.nativeDelete(RoomSchema, { job: job.id });
    // A change saved since the read above (status, details) bumped the version: refuse rather than delete it unseen.
    if ((await tx.nativeDelete(JobSchema, { id: job.id, version })) === 0) {
      throw new ConflictError(
        'The job was changed by someone else while it was being deleted. Reload it and try again.',
      );
    }
    return photos.map((p) => p.storageKey);
  });
  // Files go after the rows are gone: a failed delete leaves an orphan file, never a row without its file.
  await Promise.all(keys.map((k) => storage.delete(k).catch(() => undefined)));
}
