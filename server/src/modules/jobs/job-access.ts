import { raw, type FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { JobSchema, type Job } from './job.entity';

/**
 * Which jobs a person may see: estimators and owners the company's, a salesperson the
 * jobs they own, an installer the jobs assigned to them (the job details' installer, or a scheduled
 * `job_assignment` row of issue 15). Anything else answers 404.
 */
export function jobScope(actor: Actor): FilterQuery<Job> {
  if (actor.role === 'salesperson') return { company: actor.companyId, salesperson: actor.userId };
  if (actor.role === 'installer')
    return {
      company: actor.companyId,
      $or: [
        { assignedInstaller: actor.userId },
        {
          [raw(
            (alias: string) =>
              `exists (select 1 from "job_assignment" ja where ja."job_id" = ${alias}."id" and ja."user_id" = ?)`,
            [actor.userId],
          )]: true,
        },
      ],
    };
  return { company: actor.companyId };
}

/**
 * jobScope() as SQL over the job aliased `j` (the same rule; job-reads.ts and every plain-SQL read use it).
 */
export function jobScopeSql(actor: Actor): { sql: string; params: unknown[] } {
  if (actor.role === 'salesperson')
    return { sql: 'j.company_id = ? and j."salesperson_id" = ?', params: [actor.companyId, actor.userId] };
  if (actor.role === 'installer')
    return {
      sql: `j.company_id = ? and (j."assigned_installer_id" = ?
        or exists (select 1 from "job_assignment" ja where ja."job_id" = j."id" and ja."user_id" = ?))`,
      params: [actor.companyId, actor.userId, actor.userId],
    };
  return { sql: 'j.company_id = ?', params: [actor.companyId] };
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
