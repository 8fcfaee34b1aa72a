import { onlineManager, QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import type { RouteModule } from '../../client/src/app/router';
import { RouteError } from '../../client/src/components/errors/route-error';
import { authKeys } from '../../client/src/features/auth/query-keys';
import { mailKeys } from '../../client/src/features/mail/query-keys';
import { priceBookKeys } from '../../client/src/features/price-book/query-keys';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createJobsRoutes } from '../../client/src/app/job-routes';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { createQueryClient } from '../../client/src/lib/query-client';
import { mockFetch } from './helpers/fetch-mock';
import { bedroomInput, JOB_ID, jobRecord, roomRecord } from './helpers/walkthrough-harness';

afterEach(() => {
  vi.unstubAllGlobals();
  onlineManager.setOnline(true);
});

function renderRoute(path: string, seed?: (q: ReturnType<typeof createQueryClient>) => void) {
  const queryClient = createQueryClient();
  seed?.(queryClient);
  const router = createMemoryRouter(createJobsRoutes(queryClient), { initialEntries: [path] });
  render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

describe('pages opened with no signal say so instead of staying blank', () => {
  it('Loads with nothing held on the phone: "No signal" and what that means', async () => {
    mockFetch({});
    onlineManager.setOnline(false);
    renderRoute(`/jobs/${JOB_ID}/loads`);
    expect(await screen.findByRole('heading', { name: 'No signal' }, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByText(/nothing of this page is saved on this phone yet/)).toBeInTheDocument();
  });

  it('Loads held on the phone: the figures, with "showing what this phone last saw" and when', async () => {
    mockFetch({});
    onlineManager.setOnline(false);
    renderRoute(`/jobs/${JOB_ID}/loads`, (q) => {
      q.setQueryData(jobKeys.detail(JOB_ID), jobRecord());
      q.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
    });
    expect(
      await screen.findByText('No signal — showing what this phone last saw', undefined, { timeout: 4000 }),
    ).toBeInTheDocument();
    expect(screen.getByText(/As saved on this phone on/)).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: /Loads — Rowan Example/ })).toBeInTheDocument();
  });

  it('Options and price (the desk) with nothing held: "No signal", not a wait', async () => {
    mockFetch({});
    onlineManager.setOnline(false);
    renderRoute(`/jobs/${JOB_ID}/desk`);
    expect(await screen.findByRole('heading', { name: 'No signal' }, { timeout: 4000 })).toBeInTheDocument();
  });

  it('Jobs with no list held: words, not an endless spinner', async () => {
    mockFetch({});
    onlineManager.setOnline(false);
    renderRoute('/jobs');
    expect(
      await screen.findByText(/This phone has not saved this list yet/, undefined, { timeout: 4000 }),
    ).toBeInTheDocument();
  });

  describe('the office pages: users, e-mail, outbox, settings and the price book', () => {
    const me = {
      user: {
        id: 'u1',
        name: 'Odile Owner',
        email: 'owner@example.com',
        role: 'owner',
        active: true,
        companyId: 'c1',
        createdAt: '2026-01-01T00:00:00.000Z',
      },
      company: { id: 'c1', name: 'Example Heating', unitSystem: 'imperial' },
    };
    const pages: Array<[string, () => Promise<RouteModule>]> = [
      ['/users', () => import('../../client/src/app/routes/users')],
      ['/mail', () => import('../../client/src/app/routes/mail')],
      ['/outbox', () => import('../../client/src/app/routes/outbox')],
      ['/settings', () => import('../../client/src/app/routes/company-settings')],
      ['/price-book', () => import('../../client/src/app/routes/price-book')],
    ];

    function renderPage(path: string, load: () => Promise<RouteModule>, seed?: (q: QueryClient) => void) {
      const queryClient = createQueryClient();
      queryClient.setQueryData(authKeys.me(), me);
      seed?.(queryClient);
      const route: RouteObject = {
        path,
        lazy: async () => {
          const m = await load();
          return {
            Component: m.default,
            loader: m.clientLoader?.(queryClient),
            ErrorBoundary: m.ErrorBoundary ?? RouteError,
          };
        },
      };
      render(
        <QueryClientProvider client={queryClient}>
          <RouterProvider router={createMemoryRouter([route], { initialEntries: [path] })} />
        </QueryClientProvider>,
      );
    }

    it.each(pages)(
      '%s with nothing held on the phone: "No signal" and what that means, not a wait',
      async (path, load) => {
        mockFetch({});
        onlineManager.setOnline(false);
        renderPage(path, load);
        expect(await screen.findByRole('heading', { name: 'No signal' }, { timeout: 4000 })).toBeInTheDocument();
        expect(screen.getByText(/nothing of this page is saved on this phone yet/)).toBeInTheDocument();
      },
    );

    it('Price book with one table held: that table opens; another says "No signal" in its panel, not a spinner', async () => {
      mockFetch({});
      onlineManager.setOnline(false);
      renderPage('/price-book', pages[4]![1], (q) => q.setQueryData(priceBookKeys.table('models'), []));
      expect(await screen.findByRole('button', { name: 'Materials' }, { timeout: 4000 })).toBeInTheDocument();
      screen.getByRole('button', { name: 'Materials' }).click();
      expect(await screen.findByText(/Could not show materials/, undefined, { timeout: 4000 })).toBeInTheDocument();
      expect(screen.getByText(/nothing of this page is saved on this phone yet/)).toBeInTheDocument();
    });

    it('E-mail held on the phone: the list, with "showing what this phone last saw"', async () => {
      mockFetch({});
      onlineManager.setOnline(false);
      renderPage('/mail', pages[1]![1], (q) =>
        q.setQueryData(mailKeys.list(), [
          {
            id: 'm1',
            kind: 'new-user',
            to: 'new.person@example.com',
            subject: 'Your Gaugeline account',
            state: 'sent',
            attempts: 1,
            lastError: null,
            nextAttemptAt: null,
            sentAt: '2026-01-01T00:00:00.000Z',
            createdAt: '2026-01-01T00:00:00.000Z',
          },
        ]),
      );
      expect(
        await screen.findByText('No signal — showing what this phone last saw', undefined, { timeout: 4000 }),
      ).toBeInTheDocument();
      expect(screen.getByText(/new\.person@example\.com/)).toBeInTheDocument();
    });
  });
});
