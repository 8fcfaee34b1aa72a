import type { Request } from 'express';
import { z } from 'zod';
import { BadRequestError } from '../../lib/errors';
import { signed, type ApiRouter } from '../../lib/route';
import { WebhookSignatureError, type PaymentEvent, type Payments } from '../../services/payments';
import type { Queue } from '../../services/queue';
import { applyPaymentEvent } from './payments.service';

const VERIFIED = Symbol('verified payment event');
type VerifiedRequest = Request & { [VERIFIED]?: PaymentEvent };

/**
 * The payment service's webhooks (POST /api/hooks/payments). The `signed` policy checks the
 * Stripe-Signature header over the raw body with the SDK, and the timestamp's age: no header → 401;
 * a header that does not verify, or one signed too long ago → 400; either way nothing changes.
 * A verified event is applied once per event id (payments.service.ts).
 */
export function paymentHooks(payments: () => Payments, queue?: () => Pick<Queue, 'add'>) {
  return (api: ApiRouter): void => {
    api.route({
      method: 'post',
      path: '/',
      summary: 'Payment service webhooks (signed)',
      policy: signed((rawBody, req) => {
        const header = req.get('Stripe-Signature');
        if (!header) return false;
        try {
          (req as VerifiedRequest)[VERIFIED] = payments().parseWebhook(rawBody, header);
          return true;
        } catch (err) {
          if (err instanceof WebhookSignatureError)
            throw new BadRequestError('The webhook signature does not verify, or it was signed too long ago.');
          throw new BadRequestError('The webhook is not a readable event.');
        }
      }),
      response: z.strictObject({
        received: z.literal(true),
        outcome: z.enum(['applied', 'unchanged', 'ignored', 'unknown-intent', 'mismatch', 'duplicate']),
      }),
      handler: async ({ req, em }) => {
        const event = (req as VerifiedRequest)[VERIFIED];
        if (!event) throw new BadRequestError('The webhook is not a readable event.');
        return { received: true as const, outcome: await applyPaymentEvent(em, event, queue?.()) };
      },
    });
  };
}
