import type { EntityManager } from '@mikro-orm/postgresql';
import { proposalSnapshot, type JobStatus, type ProposalSnapshot, type SnapshotOption } from '@contract';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import { scopeSql } from '../jobs/job-reads';

/**
 * The two questions every installer-facing piece of issue 15 asks first (the packet here, the
 * commissioning record, the refrigerant log):
 *
 * - may this person open this job? An installer only a job they are assigned to (a `job_assignment` row,
 *   or the job details' installer — the one installer scope of job-access.ts); the office the company's
 *   jobs; a salesperson their own. Anything else is the same 404 as a job that does not exist.
 * - what was sold? The signed, not-cancelled version's frozen snapshot option (the option the customer
 *   signed for), never the live desk.
 */

export interface OpenJob {
  id: string;
  status: JobStatus;
  companyId: string;
}

/** The job if the actor may open it (installers: assigned only); 404 otherwise, another company's included. */
export async function assertInstallerMayOpen(em: EntityManager, actor: Actor, jobId: string): Promise<OpenJob> {
  if (!/^[0-9a-f-]{36}$/i.test(jobId)) throw new NotFoundError('The job');
  const scope = scopeSql(actor);
  const rows = await em.execute<{ id: string; status: JobStatus; company_id: string }[]>(
    `select j.id, j.status, j.company_id from "job" j where ${scope.sql} and j.id = ?`,
    [...scope.params, jobId],
  );
  const row = rows[0];
  if (!row) throw new NotFoundError('The job');
  return { id: row.id, status: row.status, companyId: row.company_id };
}

export interface SoldOption {
  proposalId: string;
  versionId: string;
  versionNumber: number;
  /** The option's position (1..3) the customer signed for. */
  position: number;
  option: SnapshotOption;
  /** The whole frozen snapshot (site, customer, loads, cautions) the option belongs to. */
  snapshot: ProposalSnapshot;
  signedAt: Date;
}

/**
 * The option the customer signed for, read from the signed version's frozen snapshot; null when the job has
 * no signature, or its signature's version was cancelled. The latest signature wins if there were several.
 * Scoped by company: another company's job is null.
 */
export async function soldOption(em: EntityManager, companyId: string, jobId: string): Promise<SoldOption | null> {
  const rows = await em.execute<
    {
      proposal_id: string;
      version_id: string;
      number: number;
      option_position: number;
      snapshot: unknown;
      signed_at: Date | string;
    }[]
  >(
    `select s."proposal_id", s."version_id", v."number", s."option_position", v."snapshot", s."signed_at"
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
  if (!option) return null;
  return {
    proposalId: row.proposal_id,
    versionId: row.version_id,
    versionNumber: Number(row.number),
    position: row.option_position,
    option,
    snapshot,
    signedAt: row.signed_at instanceof Date ? row.signed_at : new Date(row.signed_at),
  };
}
