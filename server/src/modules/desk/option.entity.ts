import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { CatalogModel, DesignInput, TakeoffEdit } from '@calc';
import type { DiscountRequestRecord, OptionPricing } from '@contract';
import { CompanySchema } from '../companies/company.entity';
import { JobSchema } from '../jobs/job.entity';
import { UserSchema } from '../users/user.entity';
import { timestamps, uuidKey } from '../../lib/entity-columns';

/** A takeoff edit as stored: calc's TakeoffEdit, carrying the generated value it replaced. */
export type StoredTakeoffEdit = TakeoffEdit;

/** A discount request as stored (ids and names of the people, ISO times). */
export type StoredDiscountRequest = DiscountRequestRecord;

/**
 * One priced option of a job: inputs only (migration …110000_design_options). Every figure is recomputed
 * from these, the job's rooms and the company's catalog and price book by calc (desk-compute.ts).
 */
export const DesignOptionSchema = defineEntity({
  name: 'DesignOption',
  tableName: 'design_option',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    job: p.manyToOne(JobSchema).deleteRule('cascade'),
    position: p.smallint(),
    name: p.string().length(60),
    /** calc's design input (zones, systems); null until the first unit is chosen. */
    design: p.json<DesignInput>().nullable(),
    pricing: p.json<OptionPricing>(),
    takeoffEdits: p.json<StoredTakeoffEdit[]>().defaultRaw("'[]'::jsonb"),
    /** The catalog records of the models the design names, as they were when chosen. */
    chosenModels: p.json<Record<string, CatalogModel>>().defaultRaw("'{}'::jsonb"),
    discountRequest: p.json<StoredDiscountRequest>().nullable(),
    preliminary: p.boolean().default(false),
    reviewedBy: p.manyToOne(UserSchema).nullable(),
    reviewedAt: p.datetime().nullable(),
    createdBy: p.manyToOne(UserSchema).nullable(),
    version: p.integer().version(),
    ...timestamps(),
  },
});

export type DesignOption = InferEntity<typeof DesignOptionSchema>;
