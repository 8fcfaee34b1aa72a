import { onlineManager, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
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

  it('Jobs with no list held: words, not an endless spinner', async () => {
    mockFetch({});
    onlineManager.setOnline(false);
    renderRoute('/jobs');
    expect(
      await screen.findByText(/This phone has not saved this list yet/, undefined, { timeout: 4000 }),
    ).toBeInTheDocument();
  });
});
