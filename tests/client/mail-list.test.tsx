import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { Suspense } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { MailMessageRecord } from '@contract';
import { MailList } from '../../client/src/features/mail/components/mail-list';
import { MailTrouble } from '../../client/src/features/mail/components/mail-trouble';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch } from './helpers/fetch-mock';

const message = (id: string, subject: string, over: Partial<MailMessageRecord> = {}): MailMessageRecord => ({
  id,
  kind: 'new-user',
  to: `${id}@example.com`,
  subject,
  state: 'sent',
  attempts: 1,
  lastError: null,
  nextAttemptAt: null,
  sentAt: '2026-12-01T10:01:00.000Z',
  createdAt: '2026-12-01T10:00:00.000Z',
  ...over,
});

const failing = message('m2', 'Welcome aboard', {
  state: 'retrying',
  attempts: 3,
  lastError: 'The mail server could not be reached (ECONNREFUSED).',
  nextAttemptAt: '2026-12-01T10:05:00.000Z',
  sentAt: null,
});

function renderList() {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <Suspense fallback="loading">
        <MailList />
      </Suspense>
    </QueryClientProvider>,
  );
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('the owner’s E-mail page', () => {
  it('puts what has not gone out first, with the reason and Try again', async () => {
    const sent = message('m1', 'Your password was changed');
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'GET /api/mail': json(200, { messages: [sent, failing] }),
      'POST /api/mail/m2/retry': json(200, { message: { ...failing, state: 'waiting', attempts: 0 } }),
    });
    renderList();
    expect(await screen.findByText('1 message has not gone out')).toBeInTheDocument();
    const notSent = screen.getByRole('list', { name: 'Not sent' });
    expect(within(notSent).getByText('Welcome aboard')).toBeInTheDocument();
    expect(within(notSent).getByText('The mail server could not be reached (ECONNREFUSED).')).toBeInTheDocument();
    expect(within(notSent).getByText(/3 tries/)).toBeInTheDocument();
    const recent = screen.getByRole('list', { name: 'Recent e-mail' });
    expect(within(recent).getByText('Your password was changed')).toBeInTheDocument();
    expect(within(recent).queryByRole('button', { name: /Try again/ })).toBeNull();

    fireEvent.click(within(notSent).getByRole('button', { name: 'Try again: Welcome aboard to m2@example.com' }));
    await vi.waitFor(() =>
      expect(
        fetch.mock.calls.some(([url, init]) => init?.method === 'POST' && String(url) === '/api/mail/m2/retry'),
      ).toBe(true),
    );
  });

  it('says so when nothing has been sent yet', async () => {
    mockFetch({ 'GET /api/mail': json(200, { messages: [] }) });
    renderList();
    expect(await screen.findByText('No e-mail yet')).toBeInTheDocument();
  });

  it('the owner’s start page says when e-mail has not gone out, and nothing when all went', async () => {
    mockFetch({ 'GET /api/mail': json(200, { messages: [message('m1', 'Sent one'), failing] }) });
    render(
      <QueryClientProvider client={createQueryClient()}>
        <MemoryRouter>
          <MailTrouble />
        </MemoryRouter>
      </QueryClientProvider>,
    );
    expect(await screen.findByText('1 e-mail has not gone out')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'See E-mail' })).toHaveAttribute('href', '/mail');
  });
});
