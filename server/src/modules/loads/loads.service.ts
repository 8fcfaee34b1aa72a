import { createHash } from 'node:crypto';
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
import { PureMemo } from '../../lib/pure-memo';
import type { ServiceContext } from '../../lib/service-context';
import { scopeSql } from '../jobs/job-reads';
import type { Job } from '../jobs/job.entity';

export interface JobLoads {
  job: Pick<Job, 'id' | 'version' | 'tightness' | 'house'>;
  designConditions: HomeInput['designConditions'];
  load: HomeLoad;
  warnings: { designConditions: PlausibilityWarning[]; rooms: Record<string, PlausibilityWarning[]> };
}

type Computed = Pick<JobLoads, 'load' | 'warnings'>;

/**
 * The recompute is a pure function of the job's saved inputs (design conditions, tightness, house,
 * rooms), so its last results are kept by a hash of exactly those inputs as the database holds
 * them, with the job's id: an edit anywhere in them is a new key. Looked up only after the scoped
 * read below has found the job for this person. Profiled with the bench (issue 11): the recompute
 * was most of the route's own CPU.
 */
const recent = new PureMemo<Computed>(200);

function inputsKey(jobId: string, inputsText: string): string {
  return `${jobId}:${createHash('sha256').update(inputsText).digest('base64url')}`;
}

/**
 * Recomputes the whole home from the saved inputs with calc's own homeLoad — the same
 * function the browser runs — so the numbers never depend on what a client sent.
 */
export async function jobLoads({ em, actor }: ServiceContext, jobId: string): Promise<JobLoads> {
  // One statement: the job in scope and its rooms' saved inputs in order, as text (parsed only when
  // they have to be worked out), and every input the result depends on as one text for the key.
  const scope = scopeSql(actor);
  const [job] = await em.execute<
    {
      id: string;
      version: number;
      tightness: Job['tightness'];
      design_conditions: Job['designConditions'];
      house: Job['house'] | null;
      room_count: number;
      rooms: string;
      inputs: string;
    }[]
  >(
    `select q.id, q.version, q.tightness, q.design_conditions, q.house, q.room_count, q.rooms::text as rooms,
       json_build_array(q.design_conditions, q.tightness, q.house, q.rooms)::text as inputs
     from (select j.id, j.version, j.tightness, j.design_conditions, j.house,
       (select count(*)::int from "room" r where r.job_id = j.id) as room_count,
       coalesce((select json_agg(r.input order by r.position, r.created_at, r.id) from "room" r where r.job_id = j.id),
         '[]'::json) as rooms
     from "job" j where j.id = ? and ${scope.sql}) q`,
    [jobId, ...scope.params],
  );
  if (!job) throw new NotFoundError('The job');
  const conditions = job.design_conditions;
  if (!conditions) {
    throw new UnprocessableError('Enter the design conditions for the site before the loads can be worked out.', {
      errors: [{ path: 'designConditions', message: 'Design conditions are missing.' }],
    });
  }
  if (job.room_count === 0) {
    throw new UnprocessableError('Add at least one room before the loads can be worked out.', {
      errors: [{ path: 'rooms', message: 'Add at least one room.' }],
    });
  }
  const house = job.house ?? {};
  const key = inputsKey(job.id, job.inputs);
  let computed = recent.get(key);
  if (!computed) {
    const rooms = JSON.parse(job.rooms) as Room[];
    const home: HomeInput = { id: job.id, designConditions: conditions, tightness: job.tightness, ...house, rooms };
    const warnings: Record<string, PlausibilityWarning[]> = {};
    for (const r of rooms) warnings[r.id] = roomPlausibilityWarnings(r);
    computed = {
      load: homeLoad({ home }),
      warnings: { designConditions: designConditionsWarnings(conditions), rooms: warnings },
    };
    recent.set(key, computed);
  }
  return {
    job: { id: job.id, version: job.version, tightness: job.tightness, house },
    designConditions: conditions,
    ...computed,
  };
}
