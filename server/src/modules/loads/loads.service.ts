import type { EntityManager } from '@mikro-orm/postgresql';
import {
  designConditionsWarnings,
  homeLoad,
  roomPlausibilityWarnings,
  type HomeInput,
  type HomeLoad,
  type PlausibilityWarning,
} from '@calc';
import { UnprocessableError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import { findJob } from '../jobs/job-access';
import type { Job } from '../jobs/job.entity';
import { RoomSchema } from '../rooms/room.entity';

export interface JobLoads {
  job: Job;
  home: HomeInput;
  load: HomeLoad;
  warnings: { designConditions: PlausibilityWarning[]; rooms: Record<string, PlausibilityWarning[]> };
}

/**
 * Recomputes the whole home from the saved inputs with calc's own homeLoad — the same
 * function the browser runs — so the numbers never depend on what a client sent.
 */
export async function jobLoads(em: EntityManager, actor: Actor, jobId: string): Promise<JobLoads> {
  const job = await findJob(em, actor, jobId);
  const conditions = job.designConditions;
  if (!conditions) {
    throw new UnprocessableError('Enter the design conditions for the site before the loads can be worked out.', {
      errors: [{ path: 'designConditions', message: 'Design conditions are missing.' }],
    });
  }
  const rows = await em.find(
    RoomSchema,
    { job: job.id },
    { orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
  );
  if (rows.length === 0) {
    throw new UnprocessableError('Add at least one room before the loads can be worked out.', {
      errors: [{ path: 'rooms', message: 'Add at least one room.' }],
    });
  }
  const home: HomeInput = {
    id: job.id,
    designConditions: conditions,
    tightness: job.tightness,
    rooms: rows.map((r) => r.input),
  };
  const load = homeLoad({ home });
  const rooms: Record<string, PlausibilityWarning[]> = {};
  for (const r of rows) rooms[r.id] = roomPlausibilityWarnings(r.input);
  return { job, home, load, warnings: { designConditions: designConditionsWarnings(conditions), rooms } };
}
