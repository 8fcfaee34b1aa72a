import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { afterSigningRecord, type AfterSigningRecord, type PayWithRecord } from '@contract';
import { apiFetch } from '../../../lib/api-client';

/**
 * The customer's page after the signature: one read (`GET …/after-signing`: the window, the deposit as the
 * payment webhooks left it, any cancellation) that both the deposit step and the cancel panel use, and the
 * two writes. The deposit is confirmed by the browser with the payment service itself, so card data never
 * passes through this app's server.
 */

/** Under the proposal's own key (`['customer-proposal', id]`), so the signing's invalidation refreshes it too. */
export const afterSigningKeys = {
  one: (proposalId: string) => ['customer-proposal', proposalId, 'after-signing'] as const,
};

const base = (proposalId: string) => `/api/proposals/${encodeURIComponent(proposalId)}`;

export function getAfterSigning(proposalId: string, signal?: AbortSignal): Promise<AfterSigningRecord> {
  return apiFetch(`${base(proposalId)}/after-signing`, { schema: afterSigningRecord, signal });
}

/** How often the page asks again while it waits for the payment service's word (a webhook to the server). */
export const WAIT_POLL_MS = 1500;

export const afterSigningQuery = (proposalId: string) =>
  queryOptions({
    queryKey: afterSigningKeys.one(proposalId),
    queryFn: ({ signal }) => getAfterSigning(proposalId, signal),
  });

/** The record, asked again every 1.5 s while `waiting` says so (a payment or a refund on its way). */
export function useAfterSigning(proposalId: string, waiting: (r: AfterSigningRecord) => boolean) {
  return useQuery({
    ...afterSigningQuery(proposalId),
    refetchInterval: (q) => (q.state.data && waiting(q.state.data) ? WAIT_POLL_MS : false),
  });
}

const depositStarted = z.object({
  paymentIntentId: z.string(),
  clientSecret: z.string().nullable(),
  amountCents: z.number().int(),
  state: z.string(),
});

/** Opens (or takes up again) the deposit's payment intent. The body is empty: the server knows the amount. */
export function startDeposit(proposalId: string) {
  return apiFetch(`${base(proposalId)}/deposit`, { method: 'POST', body: {}, schema: depositStarted });
}

export function cancelProposal(proposalId: string, reason: string) {
  const trimmed = reason.trim();
  return apiFetch(`${base(proposalId)}/cancellation`, {
    method: 'POST',
    body: trimmed ? { reason: trimmed } : {},
    schema: afterSigningRecord,
  });
}

/** What the payment service said to the browser's confirm. */
export type ConfirmOutcome = { ok: true } | { ok: false; message: string; alreadyPaid: boolean };

/**
 * Confirms the intent with the payment service from the browser, the way the service's own browser
 * library does: a form-encoded POST to `<service>/v1/payment_intents/:id/confirm` with the client secret
 * and the publishable key (no cookies, no secret key). A declined card is an answer with its message.
 */
export async function confirmWithService(
  payWith: PayWithRecord,
  intentId: string,
  clientSecret: string,
  paymentMethod: string,
): Promise<ConfirmOutcome> {
  let res: Response;
  try {
    res = await fetch(`${payWith.apiUrl}/v1/payment_intents/${encodeURIComponent(intentId)}/confirm`, {
      method: 'POST',
      credentials: 'omit',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        payment_method: paymentMethod,
        client_secret: clientSecret,
        key: payWith.publishableKey,
      }).toString(),
    });
  } catch {
    return {
      ok: false,
      message: 'The payment service could not be reached. Check the connection and try again.',
      alreadyPaid: false,
    };
  }
  if (res.ok) return { ok: true };
  const body: unknown = await res.json().catch(() => null);
  const error = typeof body === 'object' && body !== null ? Reflect.get(body, 'error') : undefined;
  const field = (name: string) => (typeof error === 'object' && error !== null ? Reflect.get(error, name) : undefined);
  const message = field('message');
  return {
    ok: false,
    message: typeof message === 'string' && message ? message : 'The payment did not go through.',
    // Paid from another tab (or before a reload) while the server had not heard yet: nothing to do but wait.
    alreadyPaid: field('code') === 'payment_intent_unexpected_state',
  };
}
