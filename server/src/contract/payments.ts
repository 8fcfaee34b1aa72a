/**
 * A deposit's states (issue 14): where the payment service's webhooks have taken it. The `payment` table's
 * CHECK allows exactly these (tests/server/contract-rules.test.ts compares them); states never move backwards.
 */
export const PAYMENT_STATES = ['created', 'succeeded', 'failed', 'refunded'] as const;
export type PaymentState = (typeof PAYMENT_STATES)[number];
