import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { DeleteJobButton } from '../../client/src/features/walkthrough/components/delete-job-button';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/lib/job-queries';
import type { JobRecord } from '../../client/src/lib/job-records';
import { createQueryClient } from '../../client/src/lib/query-client';
import { clearVersionedCsrfToken } from '../../client/src/lib/versioned-request';
import { ViewerContext, type Viewer } from '../../client/src/lib/viewer';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';
import { JOB_ID, jobRecord } from './helpers/walkthrough-harness';

beforeEach(() => {
  clearCsrfToken();
  clearVersionedCsrfToken();
});
afterEach(() => vi.unstubAllGlobals());

/** happy-dom has no window.confirm; stand in for the person's answer. */
function answerConfirm(yes: boolean) {
  const confirm = vi.fn((_message?: string) => yes);
  vi.stubGlobal('confirm', confirm);
  return confirm;
}

const OWNER: Viewer = { id: 'u-owner', role: 'owner' };
const filters = { search: '', status: '', page: 1, pageSize: 25 };

function renderButton(job: JobRecord, viewer: Viewer, queryClient: QueryClient = createQueryClient()) {
  render(
    <QueryClientProvider client={queryClient}>
      <ViewerContext.Provider value={viewer}>
        <MemoryRouter initialEntries={[`/jobs/${job.id}`]}>
          <Routes>
            <Route path="/jobs" element={<p>Jobs list</p>} />
            <Route path="/jobs/:jobId" element={<DeleteJobButton job={job} />} />
          </Routes>
        </MemoryRouter>
      </ViewerContext.Provider>
    </QueryClientProvider>,
  );
  return queryClient;
}

describe('DeleteJobButton', () => {
  it('is not there for an installer, for a won job, or for a salesperson on someone else’s job', () => {
    renderButton(jobRecord(), { id: 'u-inst', role: 'installer' });
    expect(screen.queryByRole('button', { name: 'Delete job' })).not.toBeInTheDocument();
    renderButton(jobRecord({ status: 'won' }), OWNER);
    expect(screen.queryByRole('button', { name: 'Delete job' })).not.toBeInTheDocument();
    renderButton(jobRecord(), { id: 'u-other', role: 'salesperson' });
    expect(screen.queryByRole('button', { name: 'Delete job' })).not.toBeInTheDocument();
  });

  it('is there for the owning salesperson and for an estimator on a design job', () => {
    renderButton(jobRecord(), { id: 'u1', role: 'salesperson' });
    renderButton(jobRecord({ status: 'design' }), { id: 'u-est', role: 'estimator' });
    expect(screen.getAllByRole('button', { name: 'Delete job' })).toHaveLength(2);
  });

  it('asks first; nothing is sent when the person says no', () => {
    const fetch = mockFetch({});
    const confirm = answerConfirm(false);
    renderButton(jobRecord(), OWNER);
    fireEvent.click(screen.getByRole('button', { name: 'Delete job' }));
    expect(confirm).toHaveBeenCalledWith(expect.stringContaining('Rowan Example'));
    expect(confirm.mock.calls[0]?.[0]).toMatch(/rooms and photos are deleted too/);
    expect(fetch).not.toHaveBeenCalled();
  });

  it('on yes: DELETE with If-Match, the job’s queries dropped, the list refreshed, back to the jobs list', async () => {
    const sent: RequestInit[] = [];
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`DELETE /api/jobs/${JOB_ID}`]: (init) => {
        sent.push(init ?? {});
        return { status: 204 };
      },
    });
    answerConfirm(true);
    const job = jobRecord({ version: 5 });
    const queryClient = createQueryClient();
    queryClient.setQueryData(jobKeys.detail(JOB_ID), job);
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), []);
    queryClient.setQueryData(jobKeys.list(filters), { items: [job], total: 1 });
    renderButton(job, OWNER, queryClient);

    fireEvent.click(screen.getByRole('button', { name: 'Delete job' }));
    expect(await screen.findByText('Jobs list')).toBeInTheDocument();
    expect(sent).toHaveLength(1);
    expect(headerOf(sent[0], 'If-Match')).toBe('"5"');
    expect(headerOf(sent[0], 'X-CSRF-Token')).toBe('t');
    await waitFor(() => expect(queryClient.getQueryCache().find({ queryKey: jobKeys.detail(JOB_ID) })).toBeUndefined());
    expect(queryClient.getQueryCache().find({ queryKey: jobKeys.rooms(JOB_ID) })).toBeUndefined();
    expect(queryClient.getQueryState(jobKeys.list(filters))?.isInvalidated).toBe(true);
  });

  it('a 409 shows the server’s message, keeps the job cached and stays on the page', async () => {
    const detail = 'Only a job still in walk-through or design can be deleted (this one is proposed); mark it lost instead.';
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`DELETE /api/jobs/${JOB_ID}`]: problem(409, 'conflict', detail),
    });
    answerConfirm(true);
    const job = jobRecord();
    const queryClient = createQueryClient();
    queryClient.setQueryData(jobKeys.detail(JOB_ID), job);
    renderButton(job, OWNER, queryClient);

    fireEvent.click(screen.getByRole('button', { name: 'Delete job' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(detail);
    expect(screen.queryByText('Jobs list')).not.toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Delete job' })).toBeEnabled();
    expect(queryClient.getQueryData(jobKeys.detail(JOB_ID))).toEqual(job);
  });
});
