import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { AfterSigningRecord } from '@contract';
import { CancelPanel, DepositStep } from '../../client/src/features/customer-proposal/after-signing';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const ID = '0b6f1d7e-3c55-4a8e-9c1e-2f4a5b6c7d8e';
const FAKE = 'http://127.0.0.1:54999';

function record(over: Partial<AfterSigningRecord> = {}, deposit: Partial<AfterSigningRecord['deposit']> = {}) {
  return {
    proposalId: ID,
    signedAt: '2026-11-25T18:00:00.000Z',
    window: { transactionDate: '2026-11-25', lastDayToCancel: '2026-11-30', open: true },
    deposit: {
      amountCents: 120_000,
      state: 'not-started',
      failure: null,
      paidAt: null,
      refundedAt: null,
      refundPending: false,
      ...deposit,
    },
    cancellation: null,
    payWith: { apiUrl: FAKE, publishableKey: 'pk_test_local', testMode: true },
    ...over,
  } satisfies AfterSigningRecord;
}

function renderBoth() {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <DepositStep proposalId={ID} />
      <CancelPanel proposalId={ID} />
    </QueryClientProvider>,
  );
}

const STATE = `GET /api/proposals/${ID}/after-signing`;
const bodyOf = (init: RequestInit | undefined) => new URLSearchParams(String(init?.body));

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('the deposit step', () => {
  it('offers the test methods in a marked test mode; a declined card says so and the next try pays; "Paid" only from the server', async () => {
    let paid = false;
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [STATE]: () =>
        json(200, paid ? record({}, { state: 'succeeded', paidAt: '2026-11-26T15:00:00.000Z' }) : record()),
      [`POST /api/proposals/${ID}/deposit`]: json(200, {
        paymentIntentId: 'pi_1',
        clientSecret: 'pi_1_secret_abc',
        amountCents: 120_000,
        state: 'created',
      }),
      [`POST ${FAKE}/v1/payment_intents/pi_1/confirm`]: (init) => {
        const form = bodyOf(init);
        if (form.get('payment_method') === 'pm_card_chargeDeclined')
          return json(402, { error: { type: 'card_error', message: 'Your card was declined.' } });
        // The webhook reaches the server after the confirm: from now on the server says succeeded.
        setTimeout(() => (paid = true), 0);
        return json(200, { id: 'pi_1', status: 'succeeded' });
      },
    });
    renderBoth();
    expect(await screen.findByRole('heading', { name: 'Pay the deposit of $1,200.00' })).toBeInTheDocument();
    expect(screen.getByText('Test mode — no real money moves')).toBeInTheDocument();

    fireEvent.click(screen.getByRole('radio', { name: /Test card that is declined/ }));
    fireEvent.click(screen.getByRole('button', { name: 'Pay $1,200.00' }));
    expect(await screen.findByText('The payment did not go through')).toBeInTheDocument();
    expect(screen.getByText(/Your card was declined\. Nothing was charged/)).toBeInTheDocument();
    // The amount is never sent by the browser; the card choice goes to the payment service with the secret and key.
    const depositCall = fetch.mock.calls.find(([u, i]) => String(u).endsWith('/deposit') && i?.method === 'POST');
    expect(JSON.parse(String(depositCall?.[1]?.body))).toEqual({});
    const confirm = fetch.mock.calls.find(([u]) => String(u).startsWith(FAKE));
    expect(Object.fromEntries(bodyOf(confirm?.[1]))).toEqual({
      payment_method: 'pm_card_chargeDeclined',
      client_secret: 'pi_1_secret_abc',
      key: 'pk_test_local',
    });
    expect(confirm?.[1]?.credentials).toBe('omit');

    fireEvent.click(screen.getByRole('radio', { name: /Test card that pays/ }));
    fireEvent.click(screen.getByRole('button', { name: 'Pay $1,200.00' }));
    expect(await screen.findByText(/Waiting for the payment service to confirm it/)).toBeInTheDocument();
    expect(await screen.findByRole('heading', { name: 'Deposit paid' })).toBeInTheDocument();
    expect(screen.getByText(/\$1,200\.00 on November 26, 2026/)).toBeInTheDocument();
  });

  it('says plainly when card payment is not set up, with no pay button', async () => {
    mockFetch({ [STATE]: json(200, record({ payWith: null })) });
    renderBoth();
    expect(await screen.findByText(/Paying by card is not available on this page/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Pay / })).toBeNull();
  });
});

describe('the cancel panel', () => {
  it('shows the last day in plain view, asks before cancelling, then follows the refund to "refunded"', async () => {
    let stage: 'paid' | 'cancelled' | 'refunded' = 'paid';
    const cancelled = () =>
      record(
        {
          window: { transactionDate: '2026-11-25', lastDayToCancel: '2026-11-30', open: false },
          cancellation: { at: '2026-11-27T16:00:00.000Z', method: 'page', sentOn: null, reason: 'Changed plans' },
        },
        stage === 'refunded'
          ? { state: 'refunded', paidAt: '2026-11-26T15:00:00.000Z', refundedAt: '2026-11-27T16:00:05.000Z' }
          : { state: 'succeeded', paidAt: '2026-11-26T15:00:00.000Z', refundPending: true },
      );
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [STATE]: () => {
        if (stage === 'paid') return json(200, record({}, { state: 'succeeded', paidAt: '2026-11-26T15:00:00.000Z' }));
        const r = cancelled();
        stage = 'refunded'; // the refund webhook lands before the next look
        return json(200, r);
      },
      [`POST /api/proposals/${ID}/cancellation`]: () => {
        stage = 'cancelled';
        return json(201, cancelled());
      },
    });
    renderBoth();
    expect(
      await screen.findByText(
        'You may cancel this agreement, without any penalty or obligation, until midnight at the end of Monday, November 30, 2026.',
      ),
    ).toBeInTheDocument();
    expect(screen.getByText(/16 CFR Part 429/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Cancel this agreement' }));
    expect(screen.getByText('Cancel the agreement you signed?')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Keep the agreement' }));
    expect(screen.queryByText('Cancel the agreement you signed?')).toBeNull();
    await vi.waitFor(() => expect(screen.getByRole('button', { name: 'Cancel this agreement' })).toHaveFocus());

    fireEvent.click(screen.getByRole('button', { name: 'Cancel this agreement' }));
    fireEvent.change(screen.getByLabelText('Why are you cancelling? (optional)'), {
      target: { value: ' Changed plans ' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Yes, cancel the agreement' }));
    expect(
      await screen.findByRole('heading', { name: 'Cancelled — your deposit of $1,200.00 is being refunded' }),
    ).toBeInTheDocument();
    const sent = fetch.mock.calls.find(([u, i]) => String(u).endsWith('/cancellation') && i?.method === 'POST');
    expect(JSON.parse(String(sent?.[1]?.body))).toEqual({ reason: 'Changed plans' });
    // The deposit step steps aside once cancelled.
    expect(screen.queryByRole('heading', { name: 'Deposit paid' })).toBeNull();
    expect(
      await screen.findByRole('heading', { name: 'Cancelled — your deposit of $1,200.00 has been refunded' }),
    ).toBeInTheDocument();
  });

  it('after the window: the day it ended, no button; a refusal from the server is shown', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [STATE]: json(
        200,
        record({ window: { transactionDate: '2026-11-25', lastDayToCancel: '2026-11-30', open: false } }),
      ),
    });
    renderBoth();
    expect(
      await screen.findByText('The time to cancel ended at midnight at the end of Monday, November 30, 2026.'),
    ).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Cancel this agreement' })).toBeNull();
  });

  it('a 409 from the server (the window closed while the page was open) is said in its words', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [STATE]: json(200, record()),
      [`POST /api/proposals/${ID}/cancellation`]: problem(
        409,
        'conflict',
        'The time to cancel ended at midnight at the end of November 30, 2026 (three business days after the signing, 16 CFR 429.1).',
        { lastDayToCancel: '2026-11-30' },
      ),
    });
    renderBoth();
    fireEvent.click(await screen.findByRole('button', { name: 'Cancel this agreement' }));
    fireEvent.click(screen.getByRole('button', { name: 'Yes, cancel the agreement' }));
    expect(await screen.findByText('The agreement was not cancelled')).toBeInTheDocument();
    expect(
      screen.getByText(/ended at midnight at the end of November 30, 2026 \(three business days/),
    ).toBeInTheDocument();
  });
});
