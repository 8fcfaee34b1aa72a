import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { changeStamp, timestamps, uuidKey } from '../../lib/entity-columns';

/** The homeowner a job is for. Not a user: they never sign in (later issues give them a proposal link). */
export const CustomerSchema = defineEntity({
  name: 'Customer',
  tableName: 'customer',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    name: p.string().length(160),
    email: p.string().length(254).nullable(),
    phone: p.string().length(40).nullable(),
    notes: p.text().default(''),
    /** Optimistic lock (jobs/version-lock.ts): every update and delete names the version it was made against. */
    version: p.integer().version(),
    ...changeStamp(),
    ...timestamps(),
  },
});

export type Customer = InferEntity<typeof CustomerSchema>;
