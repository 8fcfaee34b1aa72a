import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { Suspense } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ProposalLinkRecord, ProposalLinksResponse } from '@contract';
import { SendPanel } from '../../client/src/features/proposals/send/send-panel';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const JOB = '5b0c3c1e-8d1f-4c55-9a0e-3f3a1d2b7c10';
const LINKS = `/api/jobs/${JOB}/proposal/links`;

const link = (id: string, over: Partial<ProposalLinkRecord> = {}): ProposalLinkRecord => ({
  id,
  state: 'sent',
  versionNumber: 2,
  to: 'odalys@example.com',
  createdAt: '2026-12-05T09:00:00.000Z',
  createdBy: 'Estimator Eve',
  expiresAt: '2027-01-04T09:00:00.000Z',
  sentAt: '2026-12-05T09:00:05.000Z',
  revokedAt: null,
  mailProblem: null,
  nextAttemptAt: null,
  ...over,
});

const answer = (links: ProposalLinkRecord[], over: Partial<ProposalLinksResponse> = {}): ProposalLinksResponse => ({
  customerEmail: 'odalys@example.com',
  canSend: { ok: true, versionNumber: 2 },
  links,
  ...over,
});

function renderPanel() {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <Suspense fallback="loading">
        <SendPanel jobId={JOB} />
      </Suspense>
    </QueryClientProvider>,
  );
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('Send to the customer', () => {
  it('offers the customer’s e-mail, checks it, sends, and shows "Waiting to send" with the mail server’s words', async () => {
    const waiting = link('l2', {
      state: 'waiting-to-send',
      to: 'other@example.com',
      sentAt: null,
      mailProblem: 'The mail server could not be reached (ECONNREFUSED).',
      nextAttemptAt: '2026-12-05T09:05:00.000Z',
    });
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET ${LINKS}`]: json(200, answer([])),
      [`POST ${LINKS}`]: json(201, answer([waiting])),
    });
    renderPanel();
    const field = await screen.findByLabelText('Customer’s e-mail');
    expect(field).toHaveValue('odalys@example.com');
    fireEvent.change(field, { target: { value: 'not an address' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send version 2' }));
    expect(await screen.findByText('Enter a valid e-mail address.')).toBeInTheDocument();
    expect(fetch.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);

    fireEvent.change(field, { target: { value: ' Other@Example.com ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send version 2' }));
    expect(await screen.findByText('On its way to other@example.com.')).toBeInTheDocument();
    const post = fetch.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({ to: 'other@example.com' });
    const list = screen.getByRole('list', { name: 'Links sent' });
    expect(within(list).getByText('Waiting to send')).toBeInTheDocument();
    expect(
      within(list).getByText(/The mail server has not taken it yet: The mail server could not be reached/),
    ).toBeInTheDocument();
  });

  it('says why it cannot be sent instead of offering the form', async () => {
    const reason = 'Issue a version of the proposal before sending it.';
    mockFetch({ [`GET ${LINKS}`]: json(200, answer([], { canSend: { ok: false, reason } })) });
    renderPanel();
    expect(await screen.findByText(reason)).toBeInTheDocument();
    expect(screen.queryByLabelText('Customer’s e-mail')).toBeNull();
  });

  it('withdraws a link after asking, and sends again to the same address as a new link', async () => {
    const sent = link('l1');
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET ${LINKS}`]: json(200, answer([sent])),
      [`POST ${LINKS}/l1/revoke`]: json(200, answer([{ ...sent, state: 'revoked', revokedAt: sent.sentAt }])),
      [`POST ${LINKS}`]: problem(409, 'conflict', 'The job has changed since version 2 was issued.'),
    });
    renderPanel();
    const list = await screen.findByRole('list', { name: 'Links sent' });
    expect(within(list).getByText('Sent')).toBeInTheDocument();
    // Send again: a new link to the same address; the server's refusal is said in words.
    fireEvent.click(within(list).getByRole('button', { name: 'Send again' }));
    expect(await screen.findByText('The job has changed since version 2 was issued.')).toBeInTheDocument();
    const again = fetch.mock.calls.find(([url, init]) => init?.method === 'POST' && String(url) === LINKS);
    expect(JSON.parse(String(again?.[1]?.body))).toEqual({ to: 'odalys@example.com' });
    fireEvent.click(within(list).getByRole('button', { name: 'Withdraw' }));
    const ask = within(list).getByRole('group', { name: 'Withdraw this link?' });
    expect(within(ask).getByText(/It stops working at once/)).toBeInTheDocument();
    fireEvent.click(within(ask).getByRole('button', { name: 'Withdraw link' }));
    expect(await within(list).findByText('Withdrawn')).toBeInTheDocument();
    expect(
      fetch.mock.calls.some(([url, init]) => init?.method === 'POST' && String(url) === `${LINKS}/l1/revoke`),
    ).toBe(true);
    // A withdrawn link offers neither withdrawing nor sending again.
    expect(within(list).queryByRole('button', { name: 'Withdraw' })).toBeNull();
    expect(within(list).queryByRole('button', { name: 'Send again' })).toBeNull();
  });
});
