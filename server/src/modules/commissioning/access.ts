import type { EntityManager } from '@mikro-orm/postgresql';
import type { JobStatus, SnapshotOption } from '@contract';
import type { ServiceContext } from '../../lib/service-context';
import { assertInstallerMayOpen, soldOption } from '../install/assignment';

/**
 * The job a person may open for its commissioning record: pack15's one rule (installers: jobs assigned to
 * them; the office: the company's); anything else the same 404 as a job that does not exist.
 */
export async function openJob(
  { em, actor }: ServiceContext,
  jobId: string,
): Promise<{ id: string; status: JobStatus }> {
  const job = await assertInstallerMayOpen(em, actor, jobId);
  return { id: job.id, status: job.status };
}

/** What was sold: the signed, not-cancelled version's frozen option (pack15's `soldOption`); null when none. */
export async function soldOptionOf(
  em: EntityManager,
  companyId: string,
  jobId: string,
): Promise<{ option: SnapshotOption; versionId: string } | null> {
  const sold = await soldOption(em, companyId, jobId);
  return sold ? { option: sold.option, versionId: sold.versionId } : null;
}
