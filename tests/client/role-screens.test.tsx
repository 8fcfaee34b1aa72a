import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import type { ReactNode } from 'react';
import { Suspense } from 'react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../server/src/contract';
import { JobsListPage } from '../../client/src/features/jobs/components/jobs-list-page';
import { NewJobPage } from '../../client/src/features/jobs/components/new-job-page';
import { JobWalkthrough as WalkthroughView } from '../../client/src/app/routes/job-walkthrough';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { createQueryClient } from '../../client/src/lib/query-client';
import { ViewerContext } from '../../client/src/lib/viewer';
import { json, mockFetch } from './helpers/fetch-mock';
import { bedroomInput, JOB_ID, jobRecord, renderWalkthrough, roomRecord } from './helpers/walkthrough-harness';

/**
 * Screens per role (issue 10): what each person sees comes from the contract's rules, so an installer
 * is never offered a control the server would refuse, and the salesperson keeps every one.
 */
beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

const as = (role: Role, ui: ReactNode) => (
  <ViewerContext.Provider value={{ id: `u-${role}`, role }}>{ui}</ViewerContext.Provider>
);

/** Every control a person could change something with. */
const editControls = (root: HTMLElement) => root.querySelectorAll('input, select, textarea, button');

function renderJobs(role: Role, path = '/jobs') {
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter initialEntries={[path]}>
        <Suspense fallback="loading">
          {as(
            role,
            <Routes>
              <Route path="/jobs" element={<JobsListPage />} />
              <Route path="/jobs/new" element={<NewJobPage />} />
            </Routes>,
          )}
        </Suspense>
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const page = (items: unknown[], total: number) => json(200, { items, total, page: 1, pageSize: 25 });

describe('jobs list per role', () => {
  it('an installer is offered no "New job", neither the button nor the empty-state wording', async () => {
    mockFetch({ 'GET /api/jobs?page=1&pageSize=25': page([], 0) });
    renderJobs('installer');
    expect(await screen.findByText('No jobs yet')).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New job' })).toBeNull();
    expect(screen.queryByText(/New job/)).toBeNull();
    expect(screen.getByText('A job shows here once the office assigns it to you.')).toBeInTheDocument();
    // Search and status filter only: nothing that makes or changes a job.
    expect(screen.queryAllByRole('button')).toEqual([]);
  });

  it('an installer who opens /jobs/new gets no form', async () => {
    mockFetch({});
    const { container } = renderJobs('installer', '/jobs/new');
    expect(await screen.findByText('Jobs are started by the office and salespeople.')).toBeInTheDocument();
    expect(editControls(container)).toHaveLength(0);
  });

  it('a salesperson still starts jobs', async () => {
    mockFetch({ 'GET /api/jobs?page=1&pageSize=25': page([jobRecord()], 1) });
    renderJobs('salesperson');
    expect(await screen.findByRole('link', { name: 'Rowan Example' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'New job' })).toHaveAttribute('href', '/jobs/new');
  });
});

function seeded(job: Record<string, unknown> = {}) {
  const queryClient = createQueryClient();
  queryClient.setQueryData(
    jobKeys.detail(JOB_ID),
    jobRecord({ notes: 'Dog in the yard; side gate code 0000', ...job }),
  );
  queryClient.setQueryData(jobKeys.rooms(JOB_ID), [
    {
      ...roomRecord({ ...bedroomInput, notes: 'Closet ceiling is low' }, 3),
      photos: [{ id: 'p1', url: '/api/photos/p1', fileName: 'closet.jpg' }],
    },
  ]);
  queryClient.setQueryData(jobKeys.settings(), {
    unitSystem: 'imperial',
    defaultDesignConditions: null,
    version: 1,
    updatedAt: null,
  });
  return queryClient;
}

describe('the job view per role', () => {
  it('an installer reads rooms, photos and notes with no input, no button and no save pill', async () => {
    const { container } = await renderWalkthrough(as('installer', <WalkthroughView jobId={JOB_ID} />), {
      queryClient: seeded({ assignedInstaller: { id: 'u-installer', name: 'Ines Installer' } }),
    });
    const room = await screen.findByRole('article', { name: 'Bedroom 2' });
    expect(within(room).getByText('12 ft × 10 ft')).toBeInTheDocument();
    expect(within(room).getByText('Closet ceiling is low')).toBeInTheDocument();
    expect(within(room).getByRole('img', { name: 'Photo 1 of 1 of Bedroom 2' })).toBeInTheDocument();
    expect(screen.getByText('Dog in the yard; side gate code 0000')).toBeInTheDocument();
    expect(screen.getByText('Ines Installer')).toBeInTheDocument();
    expect(editControls(container)).toHaveLength(0);
    expect(screen.queryByText(/Saved|Saving|Delete/)).toBeNull();
  });

  it('a salesperson still edits: inputs, "Delete this room", and no "Mark proposed" without a proposal', async () => {
    mockFetch({ 'GET /api/customers/c1': json(200, { customer: { id: 'c1', name: 'Rowan Example', version: 1 } }) });
    const { container } = await renderWalkthrough(as('salesperson', <WalkthroughView jobId={JOB_ID} />), {
      queryClient: seeded({ status: 'design', salesperson: { id: 'u-salesperson', name: 'Sam Seller' } }),
    });
    expect(await screen.findByRole('button', { name: 'Delete this room' })).toBeInTheDocument();
    expect(screen.getByLabelText('Room name')).toHaveValue('Bedroom 2');
    // The room's open fields take typing (closed folds make theirs when first opened, issue 11).
    expect(container.querySelectorAll('input').length).toBeGreaterThan(3);
    // The job's details panel is a lazily loaded chunk (issue 11): wait for the import, not a fixed second.
    fireEvent.click(await screen.findByText(/^Job details/, undefined, { timeout: 15_000 }));
    expect(await screen.findByRole('button', { name: 'Back to walk-through' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Mark proposed' })).toBeNull();
  });
});
