import type { FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { JobSchema, type Job } from './job.entity';

/**
 * Which jobs a person may see: estimators and owners the company's, a salesperson the
 * jobs they own, an installer the jobs assigned to them. Anything else answers 404.
 */
export function jobScope(actor: Actor): FilterQuery<Job> {
  const own = ownJobsBy(actor);
  return own ? { company: actor.companyId, [own.property]: actor.userId } : { company: actor.companyId };
}

/**
 * The one rule behind jobScope() and its SQL twin scopeSql(): which of a job's people a role is limited
 * to (null: the whole company's jobs), as the entity's property and its column.
 */
export function ownJobsBy(actor: Actor): { property: 'salesperson' | 'assignedInstaller'; column: string } | null {
  if (actor.role === 'salesperson') return { property: 'salesperson', column: 'salesperson_id' };
  if (actor.role === 'installer') return { property: 'assignedInstaller', column: 'assigned_installer_id' };
  return null;
}

export const JOB_POPULATE = ['customer', 'salesperson', 'assignedInstaller'] as const;

/** A job the actor may see, as an entity to change; 404 otherwise (inside a transaction: `{ ...ctx, em: tx }`). */
export async function findJob({ em, actor }: ServiceContext, id: string): Promise<Job> {
  const job = await em.findOne(JobSchema, { $and: [jobScope(actor), { id }] }, { populate: JOB_POPULATE });
  if (!job) throw new NotFoundError('The job');
  return job;
}

/**
 * Records activity on a job without bumping its version: room and photo edits are not
 * job edits, and must not make someone editing the job's details hit a conflict.
 * Plain SQL because nativeUpdate increments the version column; runs in the caller's transaction.
 */
export async function touchJob(em: EntityManager, jobId: string, at: Date): Promise<void> {
  await em.execute('update "job" set "last_activity_at" = ? where "id" = ?', [at, jobId], 'run');
}

/**
 * touchJob for a change to what the loads are worked out from (a room added, changed or removed): the
 * loads the office reviewed are not the loads now, so the job's "ready to propose" mark (and any sizing
 * override given with it) goes, as it does when an option changes. Without a version bump, like touchJob.
 */
export async function touchJobLoads(em: EntityManager, jobId: string, at: Date): Promise<void> {
  await em.execute(
    'update "job" set "last_activity_at" = ?, "ready_at" = null, "ready_by_id" = null, "ready_override" = null where "id" = ?',
    [at, jobId],
    'run',
  );
}
