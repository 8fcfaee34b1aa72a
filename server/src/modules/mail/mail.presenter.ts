import type { MailMessageRecord } from '@contract';
import type { OutgoingMessage } from './outgoing-message.entity';

/** What the owner sees of an e-mail: who, what about and how delivery went — never its body. */
export function presentMessage(m: OutgoingMessage): MailMessageRecord {
  return {
    id: m.id,
    kind: m.kind,
    to: m.toAddress,
    subject: m.subject,
    state: m.state,
    attempts: m.attempts,
    lastError: m.lastError ?? null,
    nextAttemptAt: m.nextAttemptAt ? m.nextAttemptAt.toISOString() : null,
    sentAt: m.sentAt ? m.sentAt.toISOString() : null,
    createdAt: m.createdAt.toISOString(),
  };
}
