import { useQueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { formatMoney } from '@calc';
import type { AfterSigningRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-error';
import { afterSigningKeys, confirmWithService, startDeposit, useAfterSigning } from './api';
import { dayOf } from './dates';

/** The local payment service's test payment methods (server/src/fakes/payments-fake.ts). */
const TEST_METHODS = [
  { id: 'pm_card_visa', label: 'Test card that pays' },
  { id: 'pm_card_chargeDeclined', label: 'Test card that is declined' },
] as const;

type Step = { kind: 'idle' } | { kind: 'paying' } | { kind: 'waiting' } | { kind: 'declined'; message: string };

/**
 * "Pay the deposit of $X", after the signature. The amount is the server's (the chosen option's deposit in
 * the signed version); the browser asks the server for the payment intent, confirms it with the payment
 * service directly, then follows the server's state (set by the service's webhook): "Paid" only when the
 * server says the payment succeeded. A declined card says so and may try again.
 */
export function DepositStep({ proposalId }: { proposalId: string }) {
  const [step, setStep] = useState<Step>({ kind: 'idle' });
  const waitingForServer = (r: AfterSigningRecord) =>
    step.kind === 'waiting' && r.deposit.state !== 'succeeded' && r.deposit.state !== 'refunded';
  const query = useAfterSigning(proposalId, waitingForServer);
  const queryClient = useQueryClient();
  const [method, setMethod] = useState<string>(TEST_METHODS[0].id);
  const groupId = useId();
  const record = query.data;
  if (!record) {
    // Nothing while loading: before the signature there is nothing to show, and the page does not jump.
    return query.isError ? (
      <Alert tone="danger" title="The deposit could not be loaded">
        Reload the page to try again.
      </Alert>
    ) : null;
  }
  const { deposit } = record;
  // No deposit due, not signed yet, or cancelled (the cancel panel tells the refund).
  if (!record.signedAt || deposit.amountCents === 0 || record.cancellation) return null;
  const amount = formatMoney(deposit.amountCents);

  if (deposit.state === 'succeeded' || deposit.state === 'refunded') {
    return (
      <section aria-labelledby={`${groupId}-h`} className="rounded-lg border border-ok bg-ok-soft p-4">
        <h3 id={`${groupId}-h`} className="text-lg font-semibold text-ink-950">
          Deposit paid
        </h3>
        <p className="mt-1 text-base text-ink-950">
          {amount}
          {deposit.paidAt ? ` on ${dayOf(deposit.paidAt)}` : ''}. Thank you — your contractor will be in touch to
          schedule the work.
        </p>
      </section>
    );
  }

  const pay = async () => {
    if (!record.payWith) return;
    setStep({ kind: 'paying' });
    try {
      const intent = await startDeposit(proposalId);
      if (intent.state === 'succeeded') {
        setStep({ kind: 'waiting' });
        return;
      }
      if (!intent.clientSecret) throw new Error('The payment could not be started.');
      const outcome = await confirmWithService(record.payWith, intent.paymentIntentId, intent.clientSecret, method);
      if (!outcome.ok && !outcome.alreadyPaid) {
        setStep({ kind: 'declined', message: outcome.message });
        return;
      }
      setStep({ kind: 'waiting' });
    } catch (err) {
      setStep({
        kind: 'declined',
        message: isApiError(err) ? err.detail : 'The payment could not be started. Try again in a moment.',
      });
    } finally {
      await queryClient.invalidateQueries({ queryKey: afterSigningKeys.one(proposalId) });
    }
  };

  const waiting = step.kind === 'waiting';
  return (
    <section aria-labelledby={`${groupId}-h`} className="rounded-lg border border-line bg-white p-4 shadow-card">
      <h3 id={`${groupId}-h`} className="text-lg font-semibold text-ink-900">
        Pay the deposit of {amount}
      </h3>
      <p className="mt-1 text-base text-ink-700">
        The deposit holds your installation date. The rest is due as your agreement says.
      </p>
      {!record.payWith ? (
        <p className="mt-3 text-base text-ink-800">
          Paying by card is not available on this page. Your contractor will arrange the deposit with you.
        </p>
      ) : waiting ? (
        <p role="status" className="mt-3 flex items-center gap-2 text-base text-ink-800">
          <span
            aria-hidden="true"
            className="size-4 animate-spin rounded-full border-2 border-current border-r-transparent"
          />
          Payment sent. Waiting for the payment service to confirm it…
        </p>
      ) : (
        <>
          {step.kind === 'declined' ? (
            <div className="mt-3">
              <Alert tone="danger" title="The payment did not go through">
                {step.message} Nothing was charged. Choose a payment method and try again.
              </Alert>
            </div>
          ) : deposit.state === 'failed' && deposit.failure ? (
            <div className="mt-3">
              <Alert tone="warning" title="The last try did not go through">
                {deposit.failure} Nothing was charged. You can try again.
              </Alert>
            </div>
          ) : null}
          {record.payWith.testMode ? (
            <fieldset className="mt-4 rounded-md border-2 border-dashed border-amber-line bg-amber-soft p-3">
              <legend className="px-1 text-base font-semibold text-amber-deep">Test mode — no real money moves</legend>
              <p className="text-sm text-ink-900">
                This site uses a local stand-in for the payment service. Pick how the test payment should end.
              </p>
              <div className="mt-2 grid gap-2">
                {TEST_METHODS.map((m) => (
                  <label
                    key={m.id}
                    className="flex min-h-touch cursor-pointer items-center gap-3 rounded-md border border-line bg-white px-3"
                  >
                    <input
                      type="radio"
                      name={`${groupId}-method`}
                      value={m.id}
                      checked={method === m.id}
                      onChange={() => setMethod(m.id)}
                      className="size-5"
                    />
                    <span className="text-base text-ink-950">
                      {m.label} <span className="font-mono text-sm text-ink-700">({m.id})</span>
                    </span>
                  </label>
                ))}
              </div>
            </fieldset>
          ) : null}
          <Button className="mt-4 w-full sm:w-auto" busy={step.kind === 'paying'} onClick={() => void pay()}>
            Pay {amount}
          </Button>
        </>
      )}
    </section>
  );
}
