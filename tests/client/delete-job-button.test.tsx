import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { DeleteJobButton } from '../../client/src/features/jobs/components/delete-job-button';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import type { JobRecord } from '@contract';
import { createQueryClient } from '../../client/src/lib/query-client';
import { ViewerContext, type Viewer } from '../../client/src/lib/viewer';
import { roomTarget, type WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';
import { createPhotoQueue, PhotoQueueProvider } from '../../client/src/features/walkthrough/sync/photo-queue-context';
import { memoryFileStorage } from '../../client/src/lib/offline/file-storage';
import { WalkthroughQueueProvider } from '../../client/src/features/walkthrough/sync/queue-context';
import type { QueueItem } from '../../client/src/lib/offline/queue';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';
import { JOB_ID, jobRecord, ROOM_ID, testQueue } from './helpers/walkthrough-harness';

beforeEach(() => {
  clearCsrfToken();
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

function renderButton(
  job: JobRecord,
  viewer: Viewer,
  queryClient: QueryClient = createQueryClient(),
  stored: readonly QueueItem<WalkthroughEdit>[] = [],
  photoStorage = memoryFileStorage(),
) {
  // Offline queues on memory storage, holding what the test says is waiting on the device.
  const { queue } = testQueue(
    queryClient,
    async () => ({ kind: 'network' }),
    () => false,
    stored,
  );
  const photos = createPhotoQueue(queryClient, queue, { storage: photoStorage, isOnline: () => false, retryMs: 0 });
  void queue.start();
  void photos.start();
  render(
    <QueryClientProvider client={queryClient}>
      <WalkthroughQueueProvider queue={queue}>
        <PhotoQueueProvider queue={photos}>
          <ViewerContext.Provider value={viewer}>
            <MemoryRouter initialEntries={[`/jobs/${job.id}`]}>
              <Routes>
                <Route path="/jobs" element={<p>Jobs list</p>} />
                <Route path="/jobs/:jobId" element={<DeleteJobButton job={job} />} />
              </Routes>
            </MemoryRouter>
          </ViewerContext.Provider>
        </PhotoQueueProvider>
      </WalkthroughQueueProvider>
    </QueryClientProvider>,
  );
  return Object.assign(queryClient, { edits: queue, photos });
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
    const detail =
      'Only a job still in walk-through or design can be deleted (this one is proposed); mark it lost instead.';
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

  it('drops what of this job still waits on the device — edits, a conflict, photos — and nothing of other jobs', async () => {
    mockFetch({ 'GET /api/auth/csrf': json(200, { token: 't' }), [`DELETE /api/jobs/${JOB_ID}`]: { status: 204 } });
    answerConfirm(true);
    const OTHER_JOB = '55555555-5555-4555-8555-555555555555';
    const item = (id: string, jobId: string): QueueItem<WalkthroughEdit> => ({
      id,
      seq: Number(id.slice(1)),
      target: roomTarget(`${jobId}-room`),
      baseVersion: 1,
      queuedAt: '2026-01-01T00:00:00.000Z',
      payload: { kind: 'room-update', jobId, roomId: `${jobId}-room`, input: { name: 'Den' } },
    });
    const photoStorage = memoryFileStorage();
    const photo = (id: string, jobId: string) => ({
      id,
      seq: 1,
      jobId,
      roomId: ROOM_ID,
      fileName: 'den.jpg',
      blob: new Blob(['x'], { type: 'image/jpeg' }),
      queuedAt: '2026-01-01T00:00:00.000Z',
    });
    await photoStorage.put(photo('p-this', JOB_ID));
    await photoStorage.put(photo('p-other', OTHER_JOB));
    const job = jobRecord();
    const q = renderButton(job, OWNER, createQueryClient(), [item('e1', JOB_ID), item('e2', OTHER_JOB)], photoStorage);
    await waitFor(() => expect(q.photos.getSnapshot().waiting).toHaveLength(2));

    fireEvent.click(screen.getByRole('button', { name: 'Delete job' }));
    expect(await screen.findByText('Jobs list')).toBeInTheDocument();
    expect(q.edits.getSnapshot().items.map((i) => i.id)).toEqual(['e2']);
    expect(photoStorage.ids()).toEqual(['p-other']);
  });

  it('a job already deleted elsewhere (404) counts as done', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`DELETE /api/jobs/${JOB_ID}`]: problem(404, 'not-found', 'The job was not found.'),
    });
    answerConfirm(true);
    renderButton(jobRecord(), OWNER);
    fireEvent.click(screen.getByRole('button', { name: 'Delete job' }));
    expect(await screen.findByText('Jobs list')).toBeInTheDocument();
  });
});
