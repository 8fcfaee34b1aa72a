import { composeResetMessage } from '../modules/auth/password.service';
import { sendAbandoned, sendMessage, type SendDeps } from '../modules/mail/mail.service';
import { composeProposalLinkMessage, recordProposalSendFailed } from '../modules/proposal-links/proposal-link.service';
import { refundAbandoned, refundCancelledDeposit } from '../modules/cancellations/cancellation.service';
import { renderAbandoned, renderVersionPdf } from '../modules/proposals/proposal-pdf.service';
import { renderPacketAbandoned, renderPacketPdf } from '../modules/install/packet-pdf.service';
import { sealSignedProposal } from '../modules/signing/signed-pdf.service';
import type { Services } from '../services/services';
import type { AbandonedHandlers, TaskHandlers } from './kinds';

/** Told once a message has failed its last try (a proposal e-mail writes 'send-failed' on its trail). */
const mailFailed =
  (services: Pick<Services, 'clock'>): NonNullable<SendDeps['failed']> =>
  (em, message) =>
    message.kind === 'proposal-link' ? recordProposalSendFailed(em, message, services.clock.now()) : Promise.resolve();

/**
 * The handler of each task kind; each try works in an EntityManager of its own. The handlers are made
 * before the queue they run in, so `services.queue` is read when a task runs (a task that queues more
 * work, as sealing a signed proposal queues its e-mail); the caller sets it on the same object.
 */
export function taskHandlers(services: Omit<Services, 'queue'> & { queue?: Services['queue'] }): TaskHandlers {
  const queue = () => {
    if (!services.queue) throw new Error('The task handlers were given no queue.');
    return services.queue;
  };
  return {
    'send-email': async ({ messageId }, run) => {
      const em = services.orm.em.fork();
      await sendMessage(
        em,
        {
          mailer: services.mailer,
          clock: services.clock,
          storage: services.storage,
          // Only messages carrying a one-time link are stored without a body: the link is made as they go out.
          compose: async (tx, message) => {
            const deps = { clock: services.clock, appOrigin: services.config.APP_ORIGIN };
            if (message.kind === 'proposal-link') return composeProposalLinkMessage(tx, message, deps);
            if (message.kind === 'password-reset')
              return (
                (await composeResetMessage(tx, message, deps)) ?? {
                  notSent: 'Not sent: the account it was for is no longer active.',
                }
              );
            return { notSent: 'Not sent: the message has no text.' };
          },
          failed: mailFailed(services),
        },
        messageId,
        run,
      );
    },
    'render-proposal-pdf': ({ versionId }, run) => renderVersionPdf(services, versionId, run),
    'refund-deposit': ({ paymentId }) => refundCancelledDeposit(services.orm.em.fork(), services.payments, paymentId),
    'seal-signed-proposal': ({ signatureId }, run) =>
      sealSignedProposal({ ...services, queue: queue() }, signatureId, run),
    'render-install-packet': (payload, run) => renderPacketPdf(services, payload, run),
  };
}

/** What each kind writes when a try was lost with its process (services/queue.ts releaseAbandoned). */
export function abandonedHandlers(
  services: Pick<Services, 'orm' | 'clock'> & { queue?: Services['queue'] },
): AbandonedHandlers {
  const queue = () => {
    if (!services.queue) throw new Error('The abandoned-job handlers were given no queue.');
    return services.queue;
  };
  return {
    'send-email': ({ messageId }, run) =>
      sendAbandoned(services.orm.em.fork(), { failed: mailFailed(services) }, messageId, run),
    'render-proposal-pdf': ({ versionId }, run) => renderAbandoned(services, versionId, run),
    // A refund writes nothing while it runs: the next try finishes it (same idempotency key, one refund); a lost
    // last try is queued again, as the money is still owed.
    'refund-deposit': ({ paymentId }, run) =>
      refundAbandoned({ em: services.orm.em.fork(), queue: queue() }, paymentId, run),
    'render-install-packet': (payload, run) => renderPacketAbandoned(services, payload, run),
    // seal-signed-proposal writes nothing while it runs: its row and e-mail are written in one transaction at the end of a try.
  };
}
