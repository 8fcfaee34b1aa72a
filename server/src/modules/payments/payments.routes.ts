import { z } from 'zod';
import { PAYMENT_STATES } from '@contract';
import { link, type ApiRouter } from '../../lib/route';
import { depositDue, startDeposit } from './payments.service';

const depositResponse = z.strictObject({
  paymentIntentId: z.string(),
  /** What the customer's page hands the payment form; never logged or stored by the app. */
  clientSecret: z.string().nullable(),
  amountCents: z.number().int().positive(),
  state: z.enum(PAYMENT_STATES),
});

/**
 * The customer's deposit (a proposal-link session, `link('proposalId')`). The body is empty: the amount
 * is the chosen option's deposit in the version's frozen snapshot, so a request that names an amount
 * (or anything else) is refused with 400 before anything happens.
 */
export function paymentRoutes(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/:proposalId/deposit',
    summary: "Start (or take up again) the deposit for the proposal's current version",
    policy: link('proposalId'),
    params: z.strictObject({ proposalId: z.uuid() }),
    body: z.strictObject({}),
    response: depositResponse,
    handler: async ({ em, link: grant, params, services }) => {
      const due = await depositDue(em, grant!.companyId, params.proposalId);
      const { payment, intent } = await startDeposit(em, services.payments, due);
      return {
        paymentIntentId: intent.id,
        clientSecret: intent.clientSecret,
        amountCents: payment.amount_cents,
        state: payment.state,
      };
    },
  });
}
