import type { EntityManager } from '@mikro-orm/postgresql';
import type { Job } from '../jobs/job.entity';

/**
 * The job becomes "proposed" when its proposal is first sent. A job still on the walk-through or the desk
 * moves; one already further on (proposed, won, lost, installed) stays where it is. Runs in the sender's
 * transaction with the job row locked. (office14's job-move service replaces this once it lands.)
 */
export async function moveJobToProposed(em: EntityManager, job: Job): Promise<void> {
  if (job.status !== 'walkthrough' && job.status !== 'design') return;
  job.status = 'proposed';
  await em.flush();
}
