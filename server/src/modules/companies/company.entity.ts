import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

/** A tenant: one contracting firm. Every other record belongs to exactly one company. */
export const CompanySchema = defineEntity({
  name: 'Company',
  tableName: 'company',
  properties: {
    id: p
      .uuid()
      .primary()
      .onCreate(() => randomUUID()),
    name: p.string().length(160),
    unitSystem: p.enum(['imperial', 'metric']).default('imperial'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type Company = InferEntity<typeof CompanySchema>;
