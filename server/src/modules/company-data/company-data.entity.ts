import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { CellChange, DatasetId, PriceBookSettings } from '@calc';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import { timestamps, uuidKey } from '../../lib/entity-columns';

/** One record of one table of a company's catalog or price book; `data` is calc's parsed record. */
export const CompanyDataRowSchema = defineEntity({
  name: 'CompanyDataRow',
  tableName: 'company_data_row',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).deleteRule('cascade'),
    dataset: p.string().$type<DatasetId>(),
    key: p.string().length(80),
    data: p.json<Record<string, unknown> & { key: string }>(),
    version: p.integer().version(),
    ...timestamps(),
  },
});
export type CompanyDataRow = InferEntity<typeof CompanyDataRowSchema>;

/** Who changed a record, when, how (a form edit, an import or the demo seed), and each cell before → after. */
export const CompanyDataChangeSchema = defineEntity({
  name: 'CompanyDataChange',
  tableName: 'company_data_change',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).deleteRule('cascade'),
    dataset: p.string().$type<DatasetId>(),
    key: p.string().length(80),
    action: p.enum(['created', 'changed'] as const),
    source: p.enum(['edit', 'import', 'seed'] as const),
    changes: p.json<CellChange[]>(),
    changedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    changedAt: p.datetime().onCreate(() => new Date()),
  },
});
export type CompanyDataChange = InferEntity<typeof CompanyDataChangeSchema>;

/** The tax and the default sell rule, one row per company. */
export const PriceBookSettingsSchema = defineEntity({
  name: 'PriceBookSettings',
  tableName: 'price_book_settings',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).unique().deleteRule('cascade'),
    data: p.json<PriceBookSettings>(),
    version: p.integer().version(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type PriceBookSettingsRow = InferEntity<typeof PriceBookSettingsSchema>;
