import type { Job } from './job.entity';

const person = (u: { id: string; name: string } | null | undefined) => (u ? { id: u.id, name: u.name } : null);

/** The only shape a job leaves the server in (the same for every role: it holds no prices yet). */
export function presentJob(j: Job) {
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
    version: j.version,
    createdAt: j.createdAt.toISOString(),
    updatedAt: j.updatedAt.toISOString(),
    lastActivityAt: j.lastActivityAt.toISOString(),
  };
}

export type JobDto = ReturnType<typeof presentJob>;
