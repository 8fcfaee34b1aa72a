import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { DesignConditions, House } from '@calc';
import { JOB_STATUSES, TIGHTNESS, type DesignSources, type ReadyOverride } from '@contract';
import { CompanySchema } from '../companies/company.entity';
import { CustomerSchema } from '../customers/customer.entity';
import { UserSchema } from '../users/user.entity';
import { changeStamp, timestamps, uuidKey } from '../../lib/entity-columns';

export const JobSchema = defineEntity({
  name: 'Job',
  tableName: 'job',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    customer: p.manyToOne(CustomerSchema).index(),
    /** The salesperson who owns the job; a salesperson sees only their own. */
    salesperson: p.manyToOne(UserSchema).index(),
    assignedInstaller: p.manyToOne(UserSchema).nullable().index(),
    status: p.enum([...JOB_STATUSES]).default('walkthrough'),
    /** Why the job was lost (the company's list, or the system's "Cancelled by buyer"); null unless lost. */
    lostReason: p.string().length(80).nullable(),
    street: p.string().length(200),
    unit: p.string().length(60).default(''),
    city: p.string().length(100),
    region: p.string().length(60),
    postalCode: p.string().length(20),
    notes: p.text().default(''),
    /** calc's parsed design conditions, or null until the site's values are known. */
    designConditions: p.json<DesignConditions>().nullable(),
    /** Where each design value came from, with a free-text note (e.g. the local code table). */
    designSources: p.json<DesignSources>(),
    tightness: p.enum([...TIGHTNESS]).default('average'),
    /** Bedrooms, blower-door CFM50 and ventilation system (calc's houseSchema); {} until known. */
    house: p.json<House>().defaultRaw("'{}'::jsonb"),
    /** Marked "ready to propose" by the office (the desk module sets and clears it; null when not marked). */
    readyAt: p.datetime().nullable(),
    readyBy: p.manyToOne(UserSchema).nullable(),
    /** Units outside their sizing range the office proposes anyway, with its reason (kept and cleared with the mark). */
    readyOverride: p.json<ReadyOverride>().nullable(),
    version: p.integer().version(),
    ...changeStamp(),
    ...timestamps(),
    /** Bumped by any change to the job, its rooms or photos: the jobs list sorts on it (index (company_id, last_activity_at desc) in the migration). */
    lastActivityAt: p.datetime().onCreate(() => new Date()),
  },
});

export type Job = InferEntity<typeof JobSchema>;
