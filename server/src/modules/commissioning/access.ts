import type { EntityManager } from '@mikro-orm/postgresql';
import { proposalSnapshot, type JobStatus, type SnapshotOption } from '@contract';
import { NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { findJob } from '../jobs/job-access';

/**
 * The job a person may open for its commissioning record: the job access rule (installers: jobs assigned
 * to them; the office: the company's); anything else the same 404 as a job that does not exist.
 * pack15's `assertInstallerMayOpen` (install/assignment.ts) is the one shared rule once it is on main.
 */
export async function openJob(ctx: ServiceContext, jobId: string): Promise<{ id: string; status: JobStatus }> {
  const job = await findJob(ctx, jobId);
  return { id: job.id, status: job.status };
}

/**
 * What was sold: the option the customer signed for, from the signed, not-cancelled version's frozen
 * snapshot (the latest signature). Null when the job has none. (pack15's `soldOption` is the shared one.)
 */
export async function soldOptionOf(
  em: EntityManager,
  companyId: string,
  jobId: string,
): Promise<{ option: SnapshotOption; versionId: string } | null> {
  const rows = await em.execute<{ version_id: string; option_position: number; snapshot: unknown }[]>(
    `select s."version_id", s."option_position", v."snapshot"
       from "proposal_signature" s
       join "proposal" p on p."id" = s."proposal_id"
       join "proposal_version" v on v."id" = s."version_id"
      where s."company_id" = ? and p."company_id" = ? and p."job_id" = ?
        and not exists (select 1 from "proposal_cancellation" c where c."version_id" = s."version_id")
      order by s."signed_at" desc
      limit 1`,
    [companyId, companyId, jobId],
  );
  const row = rows[0];
  if (!row) return null;
  const snapshot = proposalSnapshot.parse(row.snapshot);
  const option = snapshot.options.find((o) => o.position === row.option_position);
  if (!option) throw new NotFoundError('The sold option');
  return { option, versionId: row.version_id };
}
