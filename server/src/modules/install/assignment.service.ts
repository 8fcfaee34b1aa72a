import { randomUUID } from 'node:crypto';
import {
  SCHEDULABLE_STATUSES,
  type AssignmentsBody,
  type JobAssignmentsResponse,
  type JobStatus,
  type MyJobsResponse,
} from '@contract';
import { ConflictError, ValidationError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { assertInstallerMayOpen } from './assignment';

/**
 * Scheduling a won job (issue 15): the office puts one or more of the company's installers on it, each for
 * a day; an installer reads their own jobs day by day. Plain SQL (a handful of rows, read and replaced whole).
 */

const mayAssignNow = (status: JobStatus): JobAssignmentsResponse['mayAssign'] =>
  (SCHEDULABLE_STATUSES as readonly string[]).includes(status)
    ? { ok: true }
    : {
        ok: false,
        reason:
          status === 'installed'
            ? 'The job is installed: there is nothing left to schedule.'
            : 'Only a won job is scheduled: the customer signs first.',
      };

async function readAssignments(ctx: ServiceContext, jobId: string) {
  return ctx.em.execute<{ user_id: string; name: string; day: string }[]>(
    `select a."user_id", u."name", a."day"::text as "day" from "job_assignment" a join "app_user" u on u."id" = a."user_id"
      where a."company_id" = ? and a."job_id" = ? order by a."day", u."name", a."user_id"`,
    [ctx.actor.companyId, jobId],
  );
}

/** The job's installers and days (office: the company's jobs; 404 outside). */
export async function getAssignments(ctx: ServiceContext, jobId: string): Promise<JobAssignmentsResponse> {
  const job = await assertInstallerMayOpen(ctx.em, ctx.actor, jobId);
  const rows = await readAssignments(ctx, job.id);
  return {
    jobId: job.id,
    status: job.status,
    mayAssign: mayAssignNow(job.status),
    assignments: rows.map((r) => ({ userId: r.user_id, name: r.name, day: r.day })),
  };
}

/**
 * Replaces the job's set in one transaction, the job row locked so two offices saving at once queue up.
 * Refused, nothing changed: a job that is not won (409 with why), anyone who is not an active installer of
 * the company (400 beside that line).
 */
export async function putAssignments(
  ctx: ServiceContext,
  jobId: string,
  body: AssignmentsBody,
): Promise<JobAssignmentsResponse> {
  await assertInstallerMayOpen(ctx.em, ctx.actor, jobId);
  await ctx.em.transactional(async (tx) => {
    const [job] = await tx.execute<{ status: JobStatus }[]>(
      'select "status" from "job" where "id" = ? and "company_id" = ? for update',
      [jobId, ctx.actor.companyId],
    );
    const may = mayAssignNow(job!.status);
    if (!may.ok) throw new ConflictError(may.reason);
    const ids = body.assignments.map((a) => a.userId);
    const found = ids.length
      ? await tx.execute<{ id: string }[]>(
          `select "id" from "app_user" where "company_id" = ? and "active" and "role" = 'installer' and "id" in (${ids
            .map(() => '?')
            .join(', ')})`,
          [ctx.actor.companyId, ...ids],
        )
      : [];
    const ok = new Set(found.map((r) => r.id));
    const wrong = body.assignments.flatMap((a, i) =>
      ok.has(a.userId)
        ? []
        : [{ path: `assignments.${i}.userId`, message: 'Choose an active installer of your company.' }],
    );
    if (wrong.length) throw new ValidationError(wrong);
    await tx.execute('delete from "job_assignment" where "company_id" = ? and "job_id" = ?', [
      ctx.actor.companyId,
      jobId,
    ]);
    const now = ctx.clock.now();
    for (const a of body.assignments)
      await tx.execute(
        `insert into "job_assignment" ("id", "company_id", "job_id", "user_id", "day", "created_by_id", "created_at")
         values (?, ?, ?, ?, ?, ?, ?)`,
        [randomUUID(), ctx.actor.companyId, jobId, a.userId, a.day, ctx.actor.userId, now],
      );
  });
  return getAssignments(ctx, jobId);
}

/** The day a list starts on by default: a week back from today (UTC), so the days just worked still show. */
export function defaultFrom(now: Date): string {
  return new Date(now.getTime() - 7 * 86_400_000).toISOString().slice(0, 10);
}

/** The signed-in installer's assigned jobs from `from` on, by day; each job with the others on it that day. */
export async function myJobs(ctx: ServiceContext, from: string | undefined): Promise<MyJobsResponse> {
  const start = from ?? defaultFrom(ctx.clock.now());
  const rows = await ctx.em.execute<
    {
      day: string;
      job_id: string;
      status: JobStatus;
      customer_name: string;
      street: string;
      unit: string;
      city: string;
      region: string;
      postal_code: string;
      crew: string[] | null;
    }[]
  >(
    `select a."day"::text as "day", j."id" as "job_id", j."status", c."name" as "customer_name", j."street", j."unit",
            j."city", j."region", j."postal_code",
            (select array_agg(u."name" order by u."name") from "job_assignment" o join "app_user" u on u."id" = o."user_id"
              where o."job_id" = a."job_id" and o."day" = a."day" and o."user_id" <> a."user_id") as "crew"
       from "job_assignment" a
       join "job" j on j."id" = a."job_id" and j."company_id" = a."company_id"
       join "customer" c on c."id" = j."customer_id"
      where a."company_id" = ? and a."user_id" = ? and a."day" >= ?
      order by a."day", j."street", j."id"
      limit 500`,
    [ctx.actor.companyId, ctx.actor.userId, start],
  );
  const days: MyJobsResponse['days'] = [];
  for (const r of rows) {
    let day = days.at(-1);
    if (!day || day.day !== r.day) days.push((day = { day: r.day, jobs: [] }));
    day.jobs.push({
      jobId: r.job_id,
      status: r.status,
      customerName: r.customer_name,
      street: r.street,
      unit: r.unit,
      city: r.city,
      region: r.region,
      postalCode: r.postal_code,
      crew: r.crew ?? [],
    });
  }
  return { from: start, days };
}
