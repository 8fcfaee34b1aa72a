import type { DesignConditions } from '@calc';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { likePattern } from '../customers/customer.schema';
import type { DesignSources, JobStatus } from '@contract';
import type { JobView } from './job.presenter';
import type { ListJobsQuery } from './job.schema';
import { jobScopeSql } from './job-access';

/**
 * Reads of jobs for the hot paths (the jobs list, the walk-through's rooms and loads): plain SQL,
 * one statement each, reading only the columns the answer shows and hydrating no entities.
 * Scope is the same as `jobScope` in job-access.ts (tests/server/jobs.test.ts and policies hold both to it).
 */

interface JobRow {
  id: string;
  status: JobStatus;
  street: string;
  unit: string;
  city: string;
  region: string;
  postal_code: string;
  notes: string;
  design_conditions: DesignConditions | null;
  design_sources: DesignSources;
  tightness: JobView['tightness'];
  house: JobView['house'] | null;
  version: number;
  created_at: Date | string;
  updated_at: Date | string;
  last_activity_at: Date | string;
  customer_id: string;
  customer_name: string;
  salesperson_id: string;
  salesperson_name: string;
  installer_id: string | null;
  installer_name: string | null;
  changed_by_name: string | null;
  changed_on_device: string | null;
  ready_at: Date | string | null;
  lost_reason: string | null;
  has_proposal: boolean;
}

const JOB_COLUMNS = `j.id, j.status, j.street, j.unit, j.city, j.region, j.postal_code, j.notes, j.design_conditions,
  j.design_sources, j.tightness, j.house, j.version, j.created_at, j.updated_at, j.last_activity_at,
  c.id as customer_id, c.name as customer_name, s.id as salesperson_id, s.name as salesperson_name,
  i.id as installer_id, i.name as installer_name, j.changed_by_name, j.changed_on_device, j.ready_at, j.lost_reason,
  exists (select 1 from "proposal" pr where pr.job_id = j.id and pr.company_id = j.company_id) as has_proposal`;
const JOB_FROM = `from "job" j join "customer" c on c.id = j.customer_id join "app_user" s on s.id = j.salesperson_id
  left join "app_user" i on i.id = j.assigned_installer_id`;

/** The scope of jobScope() as SQL (job-access.ts): the company's, the salesperson's own, the installer's assigned. */
export function scopeSql(actor: Actor): { sql: string; params: unknown[] } {
  return jobScopeSql(actor);
}

const date = (d: Date | string) => (d instanceof Date ? d : new Date(d));

function toView(r: JobRow): JobView {
  return {
    id: r.id,
    status: r.status,
    customer: { id: r.customer_id, name: r.customer_name },
    street: r.street,
    unit: r.unit,
    city: r.city,
    region: r.region,
    postalCode: r.postal_code,
    salesperson: { id: r.salesperson_id, name: r.salesperson_name },
    assignedInstaller: r.installer_id ? { id: r.installer_id, name: r.installer_name ?? '' } : null,
    notes: r.notes,
    designConditions: r.design_conditions,
    designSources: r.design_sources,
    tightness: r.tightness,
    house: r.house ?? {},
    version: r.version,
    createdAt: date(r.created_at),
    updatedAt: date(r.updated_at),
    lastActivityAt: date(r.last_activity_at),
    changedByName: r.changed_by_name,
    changedOnDevice: r.changed_on_device,
    readyAt: r.ready_at === null ? null : date(r.ready_at),
    lostReason: r.lost_reason,
    hasProposal: r.has_proposal,
  };
}

/** One page of the jobs the actor may see and how many there are, in one statement (a window count). */
export async function listJobViews(
  { em, actor }: ServiceContext,
  q: ListJobsQuery,
): Promise<{ items: JobView[]; total: number }> {
  const scope = scopeSql(actor);
  const where = [scope.sql];
  const params = [...scope.params];
  if (q.status) {
    where.push('j.status = ?');
    params.push(q.status);
  }
  if (q.search) {
    const pat = likePattern(q.search);
    where.push('(c.name ilike ? or j.street ilike ? or j.city ilike ? or j.postal_code ilike ?)');
    params.push(pat, pat, pat, pat);
  }
  const offset = (q.page - 1) * q.pageSize;
  const rows = await em.execute<(JobRow & { total: string })[]>(
    `select ${JOB_COLUMNS}, count(*) over () as total ${JOB_FROM} where ${where.join(' and ')}
     order by j.last_activity_at desc, j.id asc limit ? offset ?`,
    [...params, q.pageSize, offset],
  );
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (!rows[0] && offset > 0) {
    // A page past the end has no row to carry the count.
    const [c] = await em.execute<{ n: string }[]>(
      `select count(*) as n ${JOB_FROM} where ${where.join(' and ')}`,
      params,
    );
    total = Number(c?.n ?? 0);
  }
  return { items: rows.map(toView), total };
}

/** A job the actor may see, for reading; 404 otherwise. */
export async function findJobView({ em, actor }: ServiceContext, id: string): Promise<JobView> {
  const scope = scopeSql(actor);
  const [row] = await em.execute<JobRow[]>(`select ${JOB_COLUMNS} ${JOB_FROM} where ${scope.sql} and j.id = ?`, [
    ...scope.params,
    id,
  ]);
  if (!row) throw new NotFoundError('The job');
  return toView(row);
}
