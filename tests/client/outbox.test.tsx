import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { Suspense } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { OutboxView } from '../../client/src/features/outbox/components/outbox-view';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch } from './helpers/fetch-mock';

afterEach(() => vi.unstubAllGlobals());

describe('outbox', () => {
  it('lists messages and opens one as plain text', async () => {
    mockFetch({
      'GET /api/dev/outbox': json(200, {
        messages: [
          {
            id: 'm1',
            receivedAt: '2026-02-01T10:00:00.000Z',
            from: 'no-reply@gaugeline.example.com',
            to: ['a@example.com'],
            subject: 'Your sign-in',
            text: 'Welcome to the team.',
            html: '<b>x</b>',
          },
        ],
      }),
    });
    render(
      <QueryClientProvider client={createQueryClient()}>
        <Suspense fallback="loading">
          <OutboxView />
        </Suspense>
      </QueryClientProvider>,
    );
    fireEvent.click(await screen.findByRole('button', { name: /Your sign-in/ }));
    expect(screen.getByRole('article', { name: 'Your sign-in' })).toHaveTextContent('Welcome to the team.');
  });
});
