import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { PDF_STATES, PROPOSAL_EVENT_KINDS, type ProposalSnapshot } from '@contract';
import { CompanySchema } from '../companies/company.entity';
import { JobSchema } from '../jobs/job.entity';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/**
 * A job's proposal (issue 14; migration …070000_proposals): one per job, holding its frozen versions and
 * its audit trail. PostgreSQL refuses any change to a version's frozen columns and any delete (a trigger);
 * the audit trail is insert-only.
 */
export const ProposalSchema = defineEntity({
  name: 'Proposal',
  tableName: 'proposal',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    job: p.manyToOne(JobSchema).unique(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Proposal = InferEntity<typeof ProposalSchema>;

/**
 * One issued version: the snapshot (contract's `proposalSnapshot`, worked out by the server with calc) and
 * its SHA-256 are frozen on insert. Only `supersededAt` (once) and the PDF columns (until the PDF's hash is
 * recorded) ever change.
 */
export const ProposalVersionSchema = defineEntity({
  name: 'ProposalVersion',
  tableName: 'proposal_version',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    proposal: p.manyToOne(ProposalSchema),
    number: p.integer(),
    snapshot: p.json<ProposalSnapshot>(),
    snapshotSha256: p.string().length(64),
    calcVersion: p.string().length(40),
    issuedBy: p.manyToOne(UserSchema).nullable(),
    /** The issuer's name at the time (kept if the person is later deleted). */
    issuedByName: p.string().length(120),
    issuedAt: p.datetime(),
    supersededAt: p.datetime().nullable(),
    pdfState: p.enum([...PDF_STATES]).default('waiting'),
    pdfSha256: p.string().length(64).nullable(),
    pdfKey: p.string().length(300).nullable(),
  },
});
export type ProposalVersion = InferEntity<typeof ProposalVersionSchema>;

/** One line of the audit trail, ordered by `seq` (a database identity; never set by the code). */
export const ProposalEventSchema = defineEntity({
  name: 'ProposalEvent',
  tableName: 'proposal_event',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    proposal: p.manyToOne(ProposalSchema),
    version: p.manyToOne(ProposalVersionSchema).nullable(),
    seq: p.bigint('number').generated('always as identity').persist(false).nullable(),
    kind: p.enum([...PROPOSAL_EVENT_KINDS]),
    at: p.datetime(),
    byUser: p.manyToOne(UserSchema).nullable(),
    byCustomer: p.boolean().default(false),
    ip: p.string().length(45).nullable(),
    userAgent: p.string().length(400).nullable(),
    data: p.json<Record<string, unknown>>().defaultRaw("'{}'::jsonb"),
  },
});
export type ProposalEvent = InferEntity<typeof ProposalEventSchema>;
