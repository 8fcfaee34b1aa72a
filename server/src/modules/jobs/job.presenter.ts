import type { JobRecord } from '@contract';
import { presentLastChange, type ChangeStamp } from '../../lib/change-stamp';
import type { Job } from './job.entity';

/** What presentJob reads: a Job entity, or a plain row read for a hot path (job-reads.ts). */
export type JobView = Pick<
  Job,
  | 'id'
  | 'status'
  | 'street'
  | 'unit'
  | 'city'
  | 'region'
  | 'postalCode'
  | 'notes'
  | 'designConditions'
  | 'designSources'
  | 'tightness'
  | 'house'
  | 'version'
  | 'createdAt'
  | 'updatedAt'
  | 'lastActivityAt'
  | 'readyAt'
  | 'lostReason'
> & {
  /** Whether the job has an issued proposal (the status machine's JobFacts; job-moves.ts `jobHasProposal`). */
  hasProposal: boolean;
  customer: { id: string; name: string };
  salesperson: { id: string; name: string } | null | undefined;
  assignedInstaller: { id: string; name: string } | null | undefined;
} & ChangeStamp;

/** A loaded Job entity as a JobView, with the facts it does not hold itself. */
export function jobViewOf(j: Job, facts: { hasProposal: boolean }): JobView {
  return {
    id: j.id,
    status: j.status,
    street: j.street,
    unit: j.unit,
    city: j.city,
    region: j.region,
    postalCode: j.postalCode,
    notes: j.notes,
    designConditions: j.designConditions,
    designSources: j.designSources,
    tightness: j.tightness,
    house: j.house,
    version: j.version,
    createdAt: j.createdAt,
    updatedAt: j.updatedAt,
    lastActivityAt: j.lastActivityAt,
    readyAt: j.readyAt,
    lostReason: j.lostReason,
    customer: j.customer,
    salesperson: j.salesperson,
    assignedInstaller: j.assignedInstaller,
    changedByName: j.changedByName,
    changedOnDevice: j.changedOnDevice,
    hasProposal: facts.hasProposal,
  };
}

const person = (u: { id: string; name: string } | null | undefined) => (u ? { id: u.id, name: u.name } : null);

/** The only shape a job leaves the server in (the same for every role: it holds no prices yet). */
export function presentJob(j: JobView): JobRecord {
  return {
    id: j.id,
    status: j.status,
    customer: { id: j.customer.id, name: j.customer.name },
    site: { street: j.street, unit: j.unit, city: j.city, region: j.region, postalCode: j.postalCode },
    salesperson: person(j.salesperson),
    assignedInstaller: person(j.assignedInstaller),
    notes: j.notes,
    designConditions: j.designConditions ?? null,
    designSources: j.designSources,
    tightness: j.tightness,
    house: { ...(j.house ?? {}) },
    version: j.version,
    createdAt: j.createdAt.toISOString(),
    updatedAt: j.updatedAt.toISOString(),
    lastActivityAt: j.lastActivityAt.toISOString(),
    lastChange: presentLastChange(j),
    readyToProposeAt: j.readyAt ? j.readyAt.toISOString() : null,
    hasProposal: j.hasProposal,
    lostReason: j.lostReason ?? null,
  };
}
