import type { EntityManager } from '@mikro-orm/postgresql';
import { cancelWindow } from '../cancellations/cancellation-window';

/** A version of the job's proposal the customer signed and did not cancel (the newest), or null. */
export interface LiveSignature {
  readonly versionNumber: number;
  /** The signing day on the job site's calendar (YYYY-MM-DD): the transaction date of the cooling-off notice. */
  readonly signedOn: string;
  readonly signerName: string;
}

/**
 * The signed, not cancelled version of the job's proposal (the signing module's insert-only
 * `proposal_signature`, the cancellations module's insert-only `proposal_cancellation`). While there is
 * one, no new version is issued: a signed contract is not revised here (issue 14, the lead's decision).
 */
export async function liveSignature(
  em: EntityManager,
  companyId: string,
  jobId: string,
): Promise<LiveSignature | null> {
  const rows = await em.execute<Array<{ number: number; signed_at: Date; signer_name: string; region: string }>>(
    `select v."number", s."signed_at", s."signer_name", j."region"
       from "proposal_signature" s
       join "proposal_version" v on v."id" = s."version_id" and v."company_id" = s."company_id"
       join "proposal" p on p."id" = v."proposal_id" and p."company_id" = v."company_id"
       join "job" j on j."id" = p."job_id" and j."company_id" = p."company_id"
      where s."company_id" = ? and p."job_id" = ?
        and not exists (select 1 from "proposal_cancellation" c
                         where c."company_id" = s."company_id" and c."version_id" = s."version_id")
      order by v."number" desc limit 1`,
    [companyId, jobId],
  );
  const row = rows[0];
  if (!row) return null;
  const signedAt = new Date(row.signed_at);
  return {
    versionNumber: row.number,
    // The same day the buyer's right-to-cancel notice counts from (the site's calendar).
    signedOn: cancelWindow(signedAt, signedAt, row.region).transactionDate,
    signerName: row.signer_name,
  };
}
