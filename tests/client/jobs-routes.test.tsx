import { QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createJobsRoutes } from '../../client/src/app/job-routes';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch } from './helpers/fetch-mock';
import { bedroomInput, JOB_ID, jobRecord, roomRecord } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

function renderRoute(path: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createJobsRoutes(queryClient), { initialEntries: [path] });
  render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

describe('jobs routes', () => {
  it('loads the job and its rooms before opening the walk-through', async () => {
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord() }),
      [`GET /api/jobs/${JOB_ID}/rooms`]: json(200, { rooms: [roomRecord(bedroomInput, 3)] }),
      'GET /api/company/settings': json(200, {
        settings: { unitSystem: 'imperial', defaultDesignConditions: null, version: 0, updatedAt: null },
      }),
    });
    renderRoute(`/jobs/${JOB_ID}`);
    expect(await screen.findByRole('heading', { name: 'Rowan Example' }, { timeout: 4000 })).toBeInTheDocument();
    expect(await screen.findByLabelText('Room name')).toHaveValue('Bedroom 2');
    expect(screen.getByRole('button', { name: 'Add room' })).toBeInTheDocument();
  });

  it('answers a job address that is not an id with "not found"', async () => {
    mockFetch({});
    renderRoute('/jobs/not-a-job/loads');
    // The loaders' module loads lazily on the first route: a slow machine may take more than a second.
    expect(await screen.findByRole('heading', { name: 'Page not found' }, { timeout: 4000 })).toBeInTheDocument();
  });

  it('shows the route error when the job belongs to nobody we know', async () => {
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: {
        status: 404,
        body: { type: '/problems/not-found', title: 'Not found', status: 404, detail: 'The job was not found.' },
        headers: { 'Content-Type': 'application/problem+json' },
      },
      [`GET /api/jobs/${JOB_ID}/rooms`]: {
        status: 404,
        body: { type: '/problems/not-found', title: 'Not found', status: 404, detail: 'The job was not found.' },
        headers: { 'Content-Type': 'application/problem+json' },
      },
      'GET /api/company/settings': json(200, {
        settings: { unitSystem: 'imperial', defaultDesignConditions: null, version: 0, updatedAt: null },
      }),
    });
    renderRoute(`/jobs/${JOB_ID}/loads`);
    expect(await screen.findByRole('heading', { name: 'Not found' }, { timeout: 4000 })).toBeInTheDocument();
  });
});
