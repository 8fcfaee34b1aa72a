import type { EntityManager } from '@mikro-orm/postgresql';
import {
  designConditionsWarnings,
  homeLoad,
  roomPlausibilityWarnings,
  type HomeInput,
  type HomeLoad,
  type PlausibilityWarning,
  type Room,
} from '@calc';
import { NotFoundError, UnprocessableError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import { scopeSql } from '../jobs/job-reads';
import type { Job } from '../jobs/job.entity';

export interface JobLoads {
  job: Pick<Job, 'id' | 'version' | 'tightness' | 'house'>;
  home: HomeInput;
  load: HomeLoad;
  warnings: { designConditions: PlausibilityWarning[]; rooms: Record<string, PlausibilityWarning[]> };
}

/**
 * Recomputes the whole home from the saved inputs with calc's own homeLoad — the same
 * function the browser runs — so the numbers never depend on what a client sent.
 */
export async function jobLoads(em: EntityManager, actor: Actor, jobId: string): Promise<JobLoads> {
  // One statement: the job in scope and its rooms' saved inputs in order.
  const scope = scopeSql(actor);
  const [job] = await em.execute<
    {
      id: string;
      version: number;
      tightness: Job['tightness'];
      design_conditions: Job['designConditions'];
      house: Job['house'] | null;
      rooms: Room[];
    }[]
  >(
    `select j.id, j.version, j.tightness, j.design_conditions, j.house,
       coalesce((select json_agg(r.input order by r.position, r.created_at, r.id) from "room" r where r.job_id = j.id),
         '[]'::json) as rooms
     from "job" j where j.id = ? and ${scope.sql}`,
    [jobId, ...scope.params],
  );
  if (!job) throw new NotFoundError('The job');
  const conditions = job.design_conditions;
  if (!conditions) {
    throw new UnprocessableError('Enter the design conditions for the site before the loads can be worked out.', {
      errors: [{ path: 'designConditions', message: 'Design conditions are missing.' }],
    });
  }
  if (job.rooms.length === 0) {
    throw new UnprocessableError('Add at least one room before the loads can be worked out.', {
      errors: [{ path: 'rooms', message: 'Add at least one room.' }],
    });
  }
  const house = job.house ?? {};
  const home: HomeInput = {
    id: job.id,
    designConditions: conditions,
    tightness: job.tightness,
    ...house,
    rooms: job.rooms,
  };
  const load = homeLoad({ home });
  const rooms: Record<string, PlausibilityWarning[]> = {};
  for (const r of job.rooms) rooms[r.id] = roomPlausibilityWarnings(r);
  return {
    job: { id: job.id, version: job.version, tightness: job.tightness, house },
    home,
    load,
    warnings: { designConditions: designConditionsWarnings(conditions), rooms },
  };
}
