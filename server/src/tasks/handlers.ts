import { composeResetMessage } from '../modules/auth/password.service';
import { sendMessage } from '../modules/mail/mail.service';
import { composeProposalLinkMessage, recordProposalSendFailed } from '../modules/proposal-links/proposal-link.service';
import { refundCancelledDeposit } from '../modules/cancellations/cancellation.service';
import { renderVersionPdf } from '../modules/proposals/proposal-pdf.service';
import type { Services } from '../services/services';
import type { TaskHandlers } from './kinds';

/** The handler of each task kind; each try works in an EntityManager of its own. */
export function taskHandlers(services: Omit<Services, 'queue'>): TaskHandlers {
  return {
    'send-email': async ({ messageId }, run) => {
      const em = services.orm.em.fork();
      await sendMessage(
        em,
        {
          mailer: services.mailer,
          clock: services.clock,
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
          failed: (em, message) =>
            message.kind === 'proposal-link'
              ? recordProposalSendFailed(em, message, services.clock.now())
              : Promise.resolve(),
        },
        messageId,
        run,
      );
    },
    'render-proposal-pdf': ({ versionId }, run) => renderVersionPdf(services, versionId, run),
    'refund-deposit': ({ paymentId }) => refundCancelledDeposit(services.orm.em.fork(), services.payments, paymentId),
  };
}
