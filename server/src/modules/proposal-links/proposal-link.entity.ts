import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { OutgoingMessageSchema } from '../mail/outgoing-message.entity';
import { ProposalSchema, ProposalVersionSchema } from '../proposals/proposal.entity';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/**
 * One e-mailed link to a proposal version (migration …Migration20261209030000_proposal_links). The token is
 * made by the queue's worker as the e-mail goes out and only its SHA-256 is kept (`tokenSha256`, NULL until
 * then); the link ends at `expiresAt`, when revoked, or when its version is superseded.
 */
export const ProposalLinkSchema = defineEntity({
  name: 'ProposalLink',
  tableName: 'proposal_link',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    proposal: p.manyToOne(ProposalSchema),
    version: p.manyToOne(ProposalVersionSchema),
    message: p.manyToOne(OutgoingMessageSchema).nullable().deleteRule('set null'),
    tokenSha256: p.string().length(64).nullable().unique(),
    recipient: p.string().length(254),
    createdBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime(),
    expiresAt: p.datetime(),
    revokedAt: p.datetime().nullable(),
    revokedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});
export type ProposalLink = InferEntity<typeof ProposalLinkSchema>;
