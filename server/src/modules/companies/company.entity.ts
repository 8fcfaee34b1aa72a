import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { UNIT_SYSTEMS } from '@contract';

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
    unitSystem: p.enum([...UNIT_SYSTEMS]).default('imperial'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type Company = InferEntity<typeof CompanySchema>;
