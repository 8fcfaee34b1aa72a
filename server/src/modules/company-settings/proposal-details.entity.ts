import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/** What the company puts on every proposal; one row per company, made on the owner's first save. */
export const CompanyProposalDetailsSchema = defineEntity({
  name: 'CompanyProposalDetails',
  tableName: 'company_proposal_details',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).unique(),
    address: p.string().length(400),
    phone: p.string().length(40),
    email: p.string().length(254),
    licence: p.string().length(300),
    terms: p.text(),
    warranty: p.text(),
    cancellationExtra: p.text(),
    version: p.integer().version(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type CompanyProposalDetails = InferEntity<typeof CompanyProposalDetailsSchema>;

/**
 * The company's logo (at most one). The bytes live in the storage service under `storageKey`, a fresh uuid
 * per upload; a replaced logo's file stays while an issued proposal version's snapshot names its key.
 */
export const CompanyLogoSchema = defineEntity({
  name: 'CompanyLogo',
  tableName: 'company_logo',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).unique(),
    storageKey: p.uuid().unique(),
    contentType: p.string().length(40),
    byteSize: p.integer(),
    width: p.integer(),
    height: p.integer(),
    uploadedBy: p.manyToOne(UserSchema),
    uploadedAt: p.datetime(),
  },
});
export type CompanyLogo = InferEntity<typeof CompanyLogoSchema>;
