import { composeResetMessage } from '../modules/auth/password.service';
import { sendMessage } from '../modules/mail/mail.service';
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
          // Only password-reset messages are stored without a body: their link is made as they go out.
          compose: (tx, message) =>
            message.kind === 'password-reset'
              ? composeResetMessage(tx, message, { clock: services.clock, appOrigin: services.config.APP_ORIGIN })
              : Promise.resolve(null),
        },
        messageId,
        run,
      );
    },
    'render-proposal-pdf': ({ versionId }, run) => renderVersionPdf(services, versionId, run),
  };
}
