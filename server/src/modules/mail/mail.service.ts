import type { EntityManager } from '@mikro-orm/postgresql';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Mailer } from '../../services/mailer';
import type { Queue } from '../../services/queue';
import type { Storage } from '../../services/storage';
import type { Clock } from '../../services/services';
import type { TaskRun } from '../../tasks/kinds';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import type { MessageKind } from '@contract';
import { OutgoingMessageSchema, type OutgoingMessage } from './outgoing-message.entity';

export interface NewMessage {
  companyId: string;
  userId?: string;
  kind: MessageKind;
  to: string;
  subject: string;
  /** Null only for kinds whose body is made when sent (password-reset). */
  text: string | null;
  /** A stored file to send with it (the signed proposal's PDF): its storage key and file name. */
  attachment?: { key: string; name: string };
}

/** "Try again" also needs the job queue. */
export interface MailContext extends ServiceContext {
  readonly queue: Queue;
}

const jobKey = (messageId: string) => `email:${messageId}`;

/**
 * Records a message and queues its sending in one transaction: the job exists exactly when the
 * message does, and a request never waits for the mail server.
 */
export async function queueMessage(em: EntityManager, queue: Queue, m: NewMessage): Promise<OutgoingMessage> {
  return em.transactional(async (tx) => {
    const message = tx.create(OutgoingMessageSchema, {
      company: tx.getReference(CompanySchema, m.companyId),
      user: m.userId ? tx.getReference(UserSchema, m.userId) : null,
      kind: m.kind,
      toAddress: m.to,
      subject: m.subject,
      bodyText: m.text,
      attachmentKey: m.attachment?.key ?? null,
      attachmentName: m.attachment?.name ?? null,
      state: 'waiting',
      attempts: 0,
    });
    await tx.flush();
    await queue.add('send-email', { messageId: message.id }, { em: tx, jobKey: jobKey(message.id) });
    return message;
  });
}

/** Turns a transport error into words an owner can act on (kept on the message, shown on the E-mail page). */
export function describeMailError(err: unknown): string {
  const e = (typeof err === 'object' && err !== null ? err : {}) as {
    code?: unknown;
    responseCode?: unknown;
    response?: unknown;
    message?: unknown;
  };
  const code = typeof e.code === 'string' ? e.code : undefined;
  let text: string;
  if (typeof e.responseCode === 'number') {
    text = `The mail server refused it (${e.responseCode}): ${typeof e.response === 'string' ? e.response : ''}`;
  } else if (code && ['ECONNREFUSED', 'ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'ECONNRESET'].includes(code)) {
    text = `The mail server could not be reached (${code}).`;
  } else {
    text = typeof e.message === 'string' && e.message ? e.message : 'Sending failed.';
  }
  return text.trim().slice(0, 500);
}

/** graphile-worker waits e^min(n,10) seconds after the n-th failed try (its fail_job). */
export const retryDelayMs = (attempt: number) => Math.round(Math.exp(Math.min(attempt, 10)) * 1000);

/** A message that is not to go out after all, and why (kept on the message, shown on the E-mail page). */
export interface NotSent {
  notSent: string;
}

export interface SendDeps {
  mailer: Mailer;
  clock: Clock;
  /** Where a message's attachment is kept. */
  storage: Storage;
  /**
   * Makes the body of a message stored without one (password-reset, proposal-link), inside the sending
   * transaction, or says why it is not to be sent.
   */
  compose(em: EntityManager, message: OutgoingMessage): Promise<string | NotSent>;
  /** Told once a message has failed its last try (a proposal e-mail writes 'send-failed' on its trail). */
  failed?(em: EntityManager, message: OutgoingMessage): Promise<void>;
}

/**
 * The `send-email` task: one try at one message. A message already sent is left alone (a job that
 * ran twice sends once). A failure is written on the message and thrown, so the queue retries it.
 */
export async function sendMessage(em: EntityManager, deps: SendDeps, messageId: string, run: TaskRun): Promise<void> {
  const message = await em.findOne(OutgoingMessageSchema, { id: messageId });
  if (!message || message.state === 'sent') return;
  message.attempts = run.attempt;
  try {
    // The body is made and the mail sent inside one transaction, so a one-time link made for a
    // message that then failed to go out is rolled back with it.
    const outcome = await em.transactional(async (tx) => {
      const text = message.bodyText ?? (await deps.compose(tx, message));
      if (typeof text !== 'string') return text;
      const attachments = [];
      if (message.attachmentKey && message.attachmentName) {
        const content = await deps.storage.get(message.attachmentKey);
        if (content === null) throw new Error(`The attached file ${message.attachmentName} is missing from storage.`);
        attachments.push({ filename: message.attachmentName, content, contentType: 'application/pdf' });
      }
      await deps.mailer.send({ to: message.toAddress, subject: message.subject, text, attachments });
      return null;
    });
    message.state = outcome ? 'failed' : 'sent';
    message.sentAt = outcome ? null : deps.clock.now();
    message.lastError = outcome ? outcome.notSent : null;
    message.nextAttemptAt = null;
    await em.flush();
  } catch (err) {
    const last = run.attempt >= run.maxAttempts;
    message.state = last ? 'failed' : 'retrying';
    message.lastError = describeMailError(err);
    message.nextAttemptAt = last ? null : new Date(deps.clock.now().getTime() + retryDelayMs(run.attempt));
    await em.flush();
    if (last && deps.failed) await deps.failed(em, message);
    throw err;
  }
}

/**
 * A try lost with the process that was sending it (the queue's releaseAbandoned): the message may or may
 * not have reached the mail server. With tries left it waits for the next one; without, it is 'failed' and
 * the office's "Try again" sends it.
 */
export async function sendAbandoned(
  em: EntityManager,
  deps: Pick<SendDeps, 'failed'>,
  messageId: string,
  run: TaskRun,
): Promise<void> {
  const message = await em.findOne(OutgoingMessageSchema, { id: messageId });
  if (!message || message.state === 'sent' || message.state === 'failed') return;
  const last = run.attempt >= run.maxAttempts;
  message.attempts = run.attempt;
  message.state = last ? 'failed' : 'retrying';
  message.lastError = 'The process sending it stopped in the middle of a try.';
  message.nextAttemptAt = null;
  await em.flush();
  if (last && deps.failed) await deps.failed(em, message);
}

export function listMessages({ em, actor }: ServiceContext): Promise<OutgoingMessage[]> {
  return em.find(
    OutgoingMessageSchema,
    { company: actor.companyId },
    { orderBy: { createdAt: 'desc', id: 'asc' }, limit: 100 },
  );
}

/** "Try again": sends a message that has not gone out now, with a fresh set of tries. */
export async function retryMessage({ em, actor, queue }: MailContext, id: string) {
  return em.transactional(async (tx) => {
    const message = await tx.findOne(OutgoingMessageSchema, { id, company: actor.companyId });
    if (!message) throw new NotFoundError('The message');
    if (message.state === 'sent') throw new ConflictError('This message has already been sent.');
    message.state = 'waiting';
    message.attempts = 0;
    message.nextAttemptAt = null;
    await tx.flush();
    await queue.add('send-email', { messageId: message.id }, { em: tx, jobKey: jobKey(message.id) });
    return message;
  });
}
