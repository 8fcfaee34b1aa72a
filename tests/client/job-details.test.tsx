import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { JobDetailsPanel } from '../../client/src/features/jobs/components/job-details-panel';
import { useSuspenseQuery } from '@tanstack/react-query';
import { act } from '@testing-library/react';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { jobQueryOptions } from '../../client/src/entities/job/queries';
import type { JobRecord } from '@contract';
import { createQueryClient } from '../../client/src/lib/query-client';
import { ViewerContext, type Viewer } from '../../client/src/lib/viewer';
import type { WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';
import { overlayJob } from '../../client/src/features/walkthrough/sync/overlay';
import { useQueueState } from '../../client/src/features/walkthrough/sync/queue-context';
import type { QueueItem } from '../../client/src/lib/offline/queue';
import { JOB_ID, jobRecord, renderWalkthrough } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

const customer = {
  id: 'c1',
  name: 'Rowan Example',
  email: 'rowan@example.com',
  phone: '555-0100',
  notes: '',
  version: 1,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
};
const staff = [
  { id: 'u1', name: 'Sam Seller', role: 'salesperson' },
  { id: 'u2', name: 'Ivy Installer', role: 'installer' },
  { id: 'u3', name: 'Olive Owner', role: 'owner' },
];

interface Sent {
  method: string;
  url: string;
  body: unknown;
  ifMatch: string | undefined;
}

/** A server holding one job and its customer; `jobPatch` answers the job PATCH (default: accept). */
function server(
  jobPatch?: (body: Record<string, unknown>) => Response,
  customerPatch?: (body: Record<string, unknown>) => Response,
) {
  const sent: Sent[] = [];
  let job: JobRecord = jobRecord();
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      const headers = (init?.headers ?? {}) as Record<string, string>;
      if (url === '/api/auth/csrf') return Response.json({ token: 't' });
      const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as Record<string, unknown>) : {};
      sent.push({ method, url, body, ifMatch: headers['If-Match'] });
      if (method === 'GET' && url === '/api/customers/c1') return Response.json({ customer });
      if (method === 'GET' && url === '/api/staff') return Response.json({ staff });
      if (method === 'GET' && url === '/api/company/loss-reasons')
        return Response.json({
          lossReasons: {
            reasons: ['Price too high', 'Moved away'],
            systemReason: 'Cancelled by buyer',
            isDefault: false,
            version: 1,
          },
        });
      if (method === 'GET' && url === `/api/jobs/${JOB_ID}`) return Response.json({ job });
      if (method === 'PATCH' && url === '/api/customers/c1' && customerPatch) return customerPatch(body);
      if (method === 'PATCH' && url === '/api/customers/c1')
        return Response.json({ customer: { ...customer, ...body, version: customer.version + 1 } });
      if (method === 'PATCH' && url === `/api/jobs/${JOB_ID}`) {
        if (jobPatch) return jobPatch(body);
        const installer = staff.find((s) => s.id === body.assignedInstallerId);
        job = {
          ...job,
          ...body,
          site: { ...job.site, ...body },
          version: job.version + 1,
          assignedInstaller: installer ? { id: installer.id, name: installer.name } : job.assignedInstaller,
        } as JobRecord;
        return Response.json({ job });
      }
      throw new Error(`Unexpected fetch: ${method} ${url}`);
    }),
  );
  return { sent, writes: () => sent.filter((s) => s.method !== 'GET') };
}

async function renderPanel(
  viewer: Viewer,
  device: { online?: () => boolean; stored?: readonly QueueItem<WalkthroughEdit>[] } = {},
) {
  const queryClient = createQueryClient();
  queryClient.setQueryData(jobKeys.detail(JOB_ID), jobRecord());
  function Host() {
    // Reads the job from the cache as the walk-through does, with the waiting edits laid over it.
    const job = useSuspenseQuery(jobQueryOptions(JOB_ID)).data;
    return <JobDetailsPanel job={overlayJob(job, useQueueState().items).job} />;
  }
  const view = await renderWalkthrough(
    <ViewerContext.Provider value={viewer}>
      <Host />
    </ViewerContext.Provider>,
    { queryClient, send: 'real', ...device },
  );
  fireEvent.click(screen.getByText('Job details'));
  return { ...view, queryClient };
}

const salesperson: Viewer = { id: 'u1', role: 'salesperson' };

describe('job details on the walk-through', () => {
  it('moves the job on with the version it holds', async () => {
    const s = server();
    const { queryClient } = await renderPanel(salesperson);
    expect(screen.getByRole('button', { name: 'Mark lost' })).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Move to design' }));
    await waitFor(() => expect(queryClient.getQueryData<JobRecord>(jobKeys.detail(JOB_ID))?.status).toBe('design'));
    expect(s.writes()).toEqual([
      { method: 'PATCH', url: `/api/jobs/${JOB_ID}`, body: { status: 'design' }, ifMatch: '"2"' },
    ]);
  });

  it('marking lost asks why from the company’s list first; the status then says why', async () => {
    const s = server();
    const { queryClient } = await renderPanel(salesperson);
    fireEvent.click(screen.getByRole('button', { name: 'Mark lost' }));
    const why = await screen.findByRole('group', { name: 'Why was the job lost?' });
    // Nothing chosen: it says so and sends nothing.
    fireEvent.click(screen.getByRole('button', { name: 'Mark lost' }));
    expect(await screen.findByText('Choose a reason first.')).toBeTruthy();
    expect(s.writes()).toEqual([]);
    fireEvent.click(within(why).getByRole('radio', { name: 'Moved away' }));
    fireEvent.click(screen.getByRole('button', { name: 'Mark lost' }));
    await waitFor(() => expect(queryClient.getQueryData<JobRecord>(jobKeys.detail(JOB_ID))?.status).toBe('lost'));
    expect(s.writes()).toEqual([
      {
        method: 'PATCH',
        url: `/api/jobs/${JOB_ID}`,
        body: { status: 'lost', lostReason: 'Moved away' },
        ifMatch: '"2"',
      },
    ]);
    expect(await screen.findByText('Status: Lost: Moved away')).toBeTruthy();
  });

  it('sends only what changed: the customer’s phone to the customer, the street to the job', async () => {
    const s = server();
    await renderPanel(salesperson);
    fireEvent.change(await screen.findByLabelText('Customer phone'), { target: { value: '555-0199' } });
    fireEvent.change(screen.getByLabelText('Street address'), { target: { value: '14 Sample Lane' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText('Details saved.');
    expect(s.writes().map((w) => [w.method, w.url, w.body])).toEqual([
      ['PATCH', '/api/customers/c1', { phone: '555-0199' }],
      ['PATCH', `/api/jobs/${JOB_ID}`, { street: '14 Sample Lane' }],
    ]);
    // A salesperson does not hand jobs around: no people fields, no staff list asked for.
    expect(screen.queryByLabelText('Installer')).toBeNull();
    expect(s.sent.some((x) => x.url === '/api/staff')).toBe(false);
  });

  it('sends the customer’s version as If-Match; a 409 says someone else saved it and keeps what was typed', async () => {
    const s = server(undefined, () =>
      Response.json(
        {
          type: '/problems/conflict',
          title: 'Conflict',
          status: 409,
          detail: 'The customer was changed by someone else.',
          currentVersion: 2,
          current: { ...customer, phone: '555-0123', version: 2 },
        },
        { status: 409, headers: { 'Content-Type': 'application/problem+json' } },
      ),
    );
    await renderPanel(salesperson);
    fireEvent.change(await screen.findByLabelText('Customer phone'), { target: { value: '555-0199' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    expect(await screen.findByText(/Someone else saved this customer meanwhile/)).toBeTruthy();
    expect(s.writes().map((w) => [w.method, w.url, w.ifMatch])).toEqual([['PATCH', '/api/customers/c1', '"1"']]);
    expect(screen.getByLabelText('Customer phone')).toHaveValue('555-0199');
    // Their version is read again (after the sender's own read, which found it does not hold the phone typed).
    await waitFor(() =>
      expect(s.sent.filter((x) => x.method === 'GET' && x.url === '/api/customers/c1')).toHaveLength(3),
    );
  });

  it('typed with no signal: kept on the device, still there after a reload, sent when the connection is back', async () => {
    const s = server();
    const first = await renderPanel(salesperson, { online: () => false });
    fireEvent.change(await screen.findByLabelText('Customer phone'), { target: { value: '555-0177' } });
    fireEvent.change(screen.getByLabelText('Street address'), { target: { value: '7 Basement Way' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText('Details kept on this device; they are sent when the connection is back.');
    expect(s.writes()).toEqual([]);
    const kept = first.storage.saved();
    expect(kept.map((i) => i.payload.kind)).toEqual(['customer-update', 'job-update']);
    first.unmount();

    // The page is reloaded (same stored queue), and the connection is back.
    await renderPanel(salesperson, { stored: kept });
    await waitFor(() =>
      expect(s.writes().map((w) => [w.method, w.url, w.body, w.ifMatch])).toEqual([
        ['PATCH', '/api/customers/c1', { phone: '555-0177' }, '"1"'],
        ['PATCH', `/api/jobs/${JOB_ID}`, { street: '7 Basement Way' }, '"2"'],
      ]),
    );
    expect(await screen.findByLabelText('Street address')).toHaveValue('7 Basement Way');
    expect(screen.getByLabelText('Customer phone')).toHaveValue('555-0177');
  });

  it('shows what waits on the device after a reload with no signal', async () => {
    server();
    const kept: QueueItem<WalkthroughEdit>[] = [
      {
        id: 'q1',
        seq: 1,
        target: `job:${JOB_ID}`,
        baseVersion: 2,
        payload: { kind: 'job-update', jobId: JOB_ID, changes: { notes: 'Dog in the yard' } },
        queuedAt: '2026-01-01T00:00:00.000Z',
      },
    ];
    await renderPanel(salesperson, { online: () => false, stored: kept });
    expect(await screen.findByLabelText('Job notes')).toHaveValue('Dog in the yard');
  });

  it('says what is wrong next to the field and sends nothing', async () => {
    const s = server();
    await renderPanel(salesperson);
    fireEvent.change(await screen.findByLabelText('Customer phone'), { target: { value: 'call me' } });
    fireEvent.change(screen.getByLabelText('Postal code'), { target: { value: '' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText('Enter a phone number using digits, spaces, dashes, dots or brackets.');
    expect(screen.getByText('Enter a postal code (letters, digits, spaces or dashes).')).toBeTruthy();
    expect(s.writes()).toEqual([]);
  });

  it('on a conflict keeps what was typed and says to check and save again', async () => {
    server(() =>
      Response.json(
        { type: '/problems/conflict', title: 'Conflict', status: 409, detail: 'Changed elsewhere.', currentVersion: 3 },
        { status: 409, headers: { 'Content-Type': 'application/problem+json' } },
      ),
    );
    await renderPanel(salesperson);
    fireEvent.change(await screen.findByLabelText('Job notes'), { target: { value: 'Dog in the yard' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText(/Someone else saved this job meanwhile/);
    expect(screen.getByLabelText('Job notes')).toHaveValue('Dog in the yard');
  });

  it('lets the office assign an installer from the company’s people', async () => {
    const s = server();
    await renderPanel({ id: 'u3', role: 'owner' });
    const installer = await screen.findByLabelText('Installer');
    expect(
      within(installer)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['Not assigned yet', 'Ivy Installer']);
    expect(
      within(screen.getByLabelText('Salesperson'))
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['Sam Seller', 'Olive Owner']);
    fireEvent.change(installer, { target: { value: 'u2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText('Details saved.');
    expect(s.writes().map((w) => w.body)).toEqual([{ assignedInstallerId: 'u2' }]);
  });

  it('shows an installer who the job is with, and nothing to change', async () => {
    const s = server();
    await renderPanel({ id: 'u2', role: 'installer' });
    expect(screen.getByText('Sam Seller')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Move to design' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Save details' })).toBeNull();
    expect(s.sent).toEqual([]);
  });

  it('never sends back a field someone else changed while the form was open', async () => {
    const s = server();
    const { queryClient } = await renderPanel(salesperson);
    fireEvent.change(await screen.findByLabelText('Job notes'), { target: { value: 'Gate code 4411' } });
    // Another device moved the job to a corrected city meanwhile; this tab learns of it.
    await act(async () => {
      queryClient.setQueryData(
        jobKeys.detail(JOB_ID),
        jobRecord({ site: { ...jobRecord().site, city: 'Newtown' }, version: 3 }),
      );
      await new Promise((r) => setTimeout(r, 20));
    });
    expect(screen.getByLabelText('City or town')).toHaveValue('Testville');
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await screen.findByText('Details saved.');
    expect(s.writes().map((w) => [w.body, w.ifMatch])).toEqual([[{ notes: 'Gate code 4411' }, '"3"']]);
  });
});
