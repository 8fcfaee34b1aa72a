import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { DesignConditions } from '@calc';
import { CompanySchema } from '../companies/company.entity';
import { uuidKey } from '../../lib/entity-columns';

/** One row per company, made on the owner's first save. The unit system lives on Company itself. */
export const CompanySettingsSchema = defineEntity({
  name: 'CompanySettings',
  tableName: 'company_settings',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).unique(),
    /** Prefills new jobs' design conditions; null until the owner sets them. */
    defaultDesignConditions: p.json<DesignConditions>().nullable(),
    version: p.integer().version(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type CompanySettings = InferEntity<typeof CompanySettingsSchema>;
