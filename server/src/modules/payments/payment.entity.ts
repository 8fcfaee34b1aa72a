import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { PAYMENT_STATES } from '@contract';
import { timestamps, uuidKey } from '../../lib/entity-columns';

export { PAYMENT_STATES, type PaymentState } from '@contract';

/**
 * A proposal version's deposit: the payment service's intent, what the server asked for (never an
 * amount from the browser), and where the webhooks have taken it. One per version.
 */
export const PaymentSchema = defineEntity({
  name: 'Payment',
  tableName: 'payment',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema),
    proposalId: p.uuid(),
    proposalVersionId: p.uuid().unique(),
    amountCents: p.integer(),
    currency: p.string().default('usd'),
    intentId: p.string().length(255).unique(),
    state: p.enum([...PAYMENT_STATES]).default('created'),
    failure: p.string().length(500).nullable(),
    refundId: p.string().length(255).nullable(),
    paidAt: p.datetime().nullable(),
    refundedAt: p.datetime().nullable(),
    ...timestamps(),
  },
});

export type Payment = InferEntity<typeof PaymentSchema>;
