import type { HomeInput, Room } from '@calc';
import type { FieldError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { findJob } from '../jobs/job-access';
import type { Job } from '../jobs/job.entity';
import { RoomSchema } from '../rooms/room.entity';
import { loadCompanyDesk } from './desk-inputs';
import {
  computeOption,
  engineData,
  parseHome,
  type ComputedOption,
  type EngineData,
  type ParsedHome,
} from './desk-compute';
import { DesignOptionSchema, type DesignOption } from './option.entity';

/** A job in the actor's scope with what its options are worked out from. */
export interface DeskJob {
  readonly job: Job;
  readonly home: ParsedHome | { problem: FieldError };
  readonly data: EngineData;
}

/** The job (404 outside the actor's scope: another company, a salesperson's colleague's job, an installer's unassigned job). */
export async function readDeskJob(ctx: ServiceContext, jobId: string): Promise<DeskJob> {
  const job = await findJob(ctx, jobId);
  await ctx.em.populate(job, ['readyBy']);
  const rooms = await ctx.em.find(
    RoomSchema,
    { job: job.id },
    { orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
  );
  const data = engineData(await loadCompanyDesk(ctx.em, ctx.actor.companyId));
  return {
    job,
    home: parseHome(
      homeOf(
        job,
        rooms.map((r) => r.input),
      ),
    ),
    data,
  };
}

/** The home calc works out, or why it cannot yet. */
export function homeOf(job: Job, rooms: Room[]): HomeInput | { problem: FieldError } {
  if (!job.designConditions)
    return { problem: { path: 'designConditions', message: 'Enter the design conditions for the site first.' } };
  if (rooms.length === 0) return { problem: { path: 'rooms', message: 'Add the rooms of the walk-through first.' } };
  return { id: job.id, designConditions: job.designConditions, tightness: job.tightness, ...(job.house ?? {}), rooms };
}

export async function listOptions(ctx: ServiceContext, jobId: string): Promise<DesignOption[]> {
  return ctx.em.find(
    DesignOptionSchema,
    { job: jobId, company: ctx.actor.companyId },
    { orderBy: { position: 'asc' }, populate: ['createdBy', 'reviewedBy'] },
  );
}

export const compute = (d: DeskJob, o: DesignOption): ComputedOption => computeOption(o, d.home, d.data);
