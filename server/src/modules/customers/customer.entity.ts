import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { CompanySchema } from '../companies/company.entity';

/** The homeowner a job is for. Not a user: they never sign in (later issues give them a proposal link). */
export const CustomerSchema = defineEntity({
  name: 'Customer',
  tableName: 'customer',
  properties: {
    id: p
      .uuid()
      .primary()
      .onCreate(() => randomUUID()),
    company: p.manyToOne(CompanySchema).index(),
    name: p.string().length(160),
    email: p.string().length(254).nullable(),
    phone: p.string().length(40).nullable(),
    notes: p.text().default(''),
    /** Optimistic lock (jobs/version-lock.ts): every update and delete names the version it was made against. */
    version: p.integer().version(),
    /** Who made the latest change and on which device (lib/change-stamp.ts); null before stamps were kept. */
    changedById: p.uuid().nullable(),
    changedByName: p.string().length(120).nullable(),
    changedOnDevice: p.string().length(40).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type Customer = InferEntity<typeof CustomerSchema>;
