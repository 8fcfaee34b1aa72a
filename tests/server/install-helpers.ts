import { createHash, randomUUID } from 'node:crypto';
import type pg from 'pg';
import type { ProposalSnapshot } from '@contract';
import type { Session, TestCompany } from '../helpers/fixtures';
import { sampleSnapshot } from '../helpers/proposal-snapshot';
import { newJob } from './jobs-helpers';

/** Issue 15's server tests: a won job with a signed proposal version, built as issuing and signing leave it. */

const sha256 = (b: string) => createHash('sha256').update(b).digest('hex');

export interface SignedJob {
  jobId: string;
  proposalId: string;
  versionId: string;
  snapshot: ProposalSnapshot;
}

async function insertVersion(
  db: pg.Client,
  company: TestCompany,
  proposalId: string,
  number: number,
  snapshot: ProposalSnapshot,
): Promise<string> {
  const id = randomUUID();
  await db.query(`update proposal_version set superseded_at = now() where proposal_id = $1 and superseded_at is null`, [
    proposalId,
  ]);
  await db.query(
    `insert into proposal_version (id, company_id, proposal_id, number, snapshot, snapshot_sha256, calc_version,
       issued_by_id, issued_by_name, issued_at) values ($1, $2, $3, $4, $5, $6, '0.1.0', $7, 'Test estimator', now())`,
    [
      id,
      company.id,
      proposalId,
      number,
      JSON.stringify(snapshot),
      sha256(JSON.stringify(snapshot)),
      company.users.estimator.id,
    ],
  );
  return id;
}

/**
 * A job of `company` whose proposal has version 1 (superseded) and version 2, version 2 signed for option
 * `position` (a typed signature) and the job moved to won. `edit` changes version 2's snapshot before it is
 * stored (version 1 keeps the sample as it is), so a test can tell the versions apart.
 */
export async function signedJob(
  db: pg.Client,
  company: TestCompany,
  estimator: Session,
  opts: { position?: number; customer?: string; edit?: (s: ProposalSnapshot) => void; sign?: boolean } = {},
): Promise<SignedJob> {
  const job = await newJob(estimator);
  const proposalId = randomUUID();
  await db.query(`insert into proposal (id, company_id, job_id, created_at) values ($1, $2, $3, now())`, [
    proposalId,
    company.id,
    job.id,
  ]);
  const customer = opts.customer ?? 'Odalys Brackenridge';
  await insertVersion(db, company, proposalId, 1, sampleSnapshot(customer));
  const snapshot = sampleSnapshot(customer);
  opts.edit?.(snapshot);
  const versionId = await insertVersion(db, company, proposalId, 2, snapshot);
  if (opts.sign !== false) {
    const statement = 'I accept the option named above.';
    await db.query(
      `insert into proposal_signature (id, company_id, proposal_id, version_id, option_position, signer_name,
         signer_email, method, typed_name, statement, statement_sha256, document_sha256, snapshot_sha256,
         consent_sha256, signed_at)
       values ($1, $2, $3, $4, $5, $6, 'odalys@example.com', 'typed', $6, $7, $8, $9, $10, $11, now())`,
      [
        randomUUID(),
        company.id,
        proposalId,
        versionId,
        opts.position ?? 2,
        customer,
        statement,
        sha256(statement),
        sha256('pdf'),
        sha256(JSON.stringify(snapshot)),
        sha256('consent'),
      ],
    );
    await db.query(`update job set status = 'won', version = version + 1 where id = $1`, [job.id]);
  }
  return { jobId: job.id, proposalId, versionId, snapshot };
}

/** The buyer's cancellation of the signed version (as the cancellation slice records one from the page). */
export async function cancelSigned(db: pg.Client, company: TestCompany, job: SignedJob): Promise<void> {
  await db.query(
    `insert into proposal_cancellation (id, company_id, proposal_id, version_id, at, method, by_customer, last_day_to_cancel)
     values ($1, $2, $3, $4, now(), 'page', true, current_date + 3)`,
    [randomUUID(), company.id, job.proposalId, job.versionId],
  );
  await db.query(
    `update job set status = 'lost', lost_reason = 'Cancelled by buyer', version = version + 1 where id = $1`,
    [job.jobId],
  );
}

/** Schedules `userId` on the job for `day` straight in the table (the route's own tests go through the API). */
export async function assignDirect(
  db: pg.Client,
  company: TestCompany,
  jobId: string,
  userId: string,
  day = '2026-12-14',
): Promise<void> {
  await db.query(
    `insert into job_assignment (id, company_id, job_id, user_id, day, created_by_id, created_at)
     values ($1, $2, $3, $4, $5, $6, now())`,
    [randomUUID(), company.id, jobId, userId, day, company.users.owner.id],
  );
}
