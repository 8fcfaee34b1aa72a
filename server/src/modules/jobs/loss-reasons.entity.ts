import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { uuidKey } from '../../lib/entity-columns';

/** The owner's list of reasons a job is lost (migration …09010000); one row per company, made on the first save. */
export const CompanyLossReasonsSchema = defineEntity({
  name: 'CompanyLossReasons',
  tableName: 'company_loss_reasons',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).unique(),
    reasons: p.json<string[]>(),
    version: p.integer().version(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type CompanyLossReasons = InferEntity<typeof CompanyLossReasonsSchema>;
