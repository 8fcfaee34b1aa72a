import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useEffect, useId, useRef, useState } from 'react';
import { formatMoney } from '@calc';
import { CANCELLATION_REASON_MAX } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-error';
import { afterSigningKeys, cancelProposal, useAfterSigning } from './api';
import { longDate } from './dates';

/**
 * The buyer's right to cancel, after signing (16 CFR Part 429, the FTC's rule for sales made at the home):
 * the notice in plain view with the last day, worked out by the server on the job site's calendar; a
 * cancel button with a confirm step; then the refund of any deposit as the server reports it.
 */
export function CancelPanel({ proposalId }: { proposalId: string }) {
  const query = useAfterSigning(proposalId, (r) => r.deposit.refundPending);
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const [reason, setReason] = useState('');
  const ids = useId();
  const cancelButton = useRef<HTMLButtonElement>(null);
  const wasConfirming = useRef(false);
  // "Keep the agreement" puts the focus back on the button that opened the question.
  useEffect(() => {
    if (wasConfirming.current && !confirming) cancelButton.current?.focus();
    wasConfirming.current = confirming;
  }, [confirming]);
  const cancel = useMutation({
    mutationFn: () => cancelProposal(proposalId, reason),
    onSuccess: (record) => queryClient.setQueryData(afterSigningKeys.one(proposalId), record),
    onError: () => void queryClient.invalidateQueries({ queryKey: afterSigningKeys.one(proposalId) }),
  });
  const record = query.data;
  if (!record?.signedAt || !record.window) return null;
  const { window, deposit, cancellation } = record;
  const paid = deposit.state === 'succeeded' || deposit.state === 'refunded';
  const amount = formatMoney(deposit.amountCents);

  if (cancellation) {
    return (
      <section aria-labelledby={`${ids}-h`} className="rounded-lg border border-line bg-white p-4 shadow-card">
        <h3 id={`${ids}-h`} className="text-lg font-semibold text-ink-900">
          {!paid
            ? 'Cancelled'
            : deposit.state === 'refunded'
              ? `Cancelled — your deposit of ${amount} has been refunded`
              : `Cancelled — your deposit of ${amount} is being refunded`}
        </h3>
        <p role="status" className="mt-1 text-base text-ink-800">
          {!paid
            ? 'You cancelled this agreement. Nothing was charged, and nothing more is owed.'
            : deposit.state === 'refunded'
              ? 'The payment service has returned the money to your card. It can take a few days to show on your statement.'
              : 'The refund has been asked of the payment service. This page updates when it is done.'}
        </p>
      </section>
    );
  }

  const failed = cancel.error;
  return (
    <section aria-labelledby={`${ids}-h`} className="rounded-lg border border-line bg-white p-4 shadow-card">
      <h3 id={`${ids}-h`} className="text-lg font-semibold text-ink-900">
        Your right to cancel
      </h3>
      {window.open ? (
        <p className="mt-1 text-base font-semibold text-ink-950">
          You may cancel this agreement, without any penalty or obligation, until midnight at the end of{' '}
          {longDate(window.lastDayToCancel)}.
        </p>
      ) : (
        <p className="mt-1 text-base text-ink-950">
          The time to cancel ended at midnight at the end of {longDate(window.lastDayToCancel)}.
        </p>
      )}
      <p className="mt-2 text-sm text-ink-700">
        The US Federal Trade Commission's rule for sales made at your home (16 CFR Part 429) gives you three business
        days after you sign. Sundays and federal holidays do not count.
        {paid ? ` If you cancel, your deposit of ${amount} is refunded to your card.` : ''}
      </p>
      {failed ? (
        <div className="mt-3">
          <Alert tone="danger" title="The agreement was not cancelled">
            {isApiError(failed) ? failed.detail : 'Check the connection and try again.'}
          </Alert>
        </div>
      ) : null}
      {window.open && !confirming ? (
        <Button
          ref={cancelButton}
          variant="secondary"
          className="mt-4 w-full sm:w-auto"
          onClick={() => setConfirming(true)}
        >
          Cancel this agreement
        </Button>
      ) : null}
      {window.open && confirming ? (
        <div
          role="group"
          aria-labelledby={`${ids}-confirm`}
          className="mt-4 rounded-md border-2 border-danger bg-danger-soft p-3"
        >
          <p id={`${ids}-confirm`} className="text-base font-semibold text-ink-950">
            Cancel the agreement you signed?
          </p>
          <p className="mt-1 text-base text-ink-900">
            The work will not go ahead{paid ? ` and your deposit of ${amount} will be refunded` : ''}. This cannot be
            undone on this page.
          </p>
          <label htmlFor={`${ids}-reason`} className="mt-3 block text-base font-semibold text-ink-900">
            Why are you cancelling? (optional)
          </label>
          <textarea
            id={`${ids}-reason`}
            value={reason}
            maxLength={CANCELLATION_REASON_MAX}
            onChange={(e) => setReason(e.target.value)}
            rows={3}
            className="mt-1 w-full rounded-md border border-line bg-white p-2 text-base"
          />
          <div className="mt-3 flex flex-col gap-2 sm:flex-row">
            <Button variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate()}>
              Yes, cancel the agreement
            </Button>
            <Button variant="secondary" disabled={cancel.isPending} onClick={() => setConfirming(false)}>
              Keep the agreement
            </Button>
          </div>
        </div>
      ) : null}
    </section>
  );
}
