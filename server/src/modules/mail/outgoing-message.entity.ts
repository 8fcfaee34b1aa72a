import { MESSAGE_KINDS, MESSAGE_STATES } from '@contract';
import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import { timestamps, uuidKey } from '../../lib/entity-columns';

/**
 * One e-mail the app sends, with its delivery state. The job queue's `send-email` task sends it;
 * the owner's E-mail page lists the ones that keep failing. A password-reset message has no stored
 * body: its one-time link is made when it is sent, so the raw token never reaches the database.
 */
export const OutgoingMessageSchema = defineEntity({
  name: 'OutgoingMessage',
  tableName: 'outgoing_message',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema),
    user: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    kind: p.enum([...MESSAGE_KINDS]),
    toAddress: p.string().length(254),
    subject: p.string().length(300),
    bodyText: p.text().nullable(),
    /** A stored file sent with the message (services/storage key) and the file name it goes out under. */
    attachmentKey: p.string().length(300).nullable(),
    attachmentName: p.string().length(120).nullable(),
    state: p.enum([...MESSAGE_STATES]).default('waiting'),
    attempts: p.integer().default(0),
    lastError: p.string().length(500).nullable(),
    nextAttemptAt: p.datetime().nullable(),
    sentAt: p.datetime().nullable(),
    ...timestamps(),
  },
});

export type OutgoingMessage = InferEntity<typeof OutgoingMessageSchema>;
