import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UNIT_SYSTEMS } from '@contract';
import { timestamps, uuidKey } from '../../lib/entity-columns';

/** A tenant: one contracting firm. Every other record belongs to exactly one company. */
export const CompanySchema = defineEntity({
  name: 'Company',
  tableName: 'company',
  properties: {
    id: uuidKey(),
    name: p.string().length(160),
    unitSystem: p.enum([...UNIT_SYSTEMS]).default('imperial'),
    ...timestamps(),
  },
});

export type Company = InferEntity<typeof CompanySchema>;
