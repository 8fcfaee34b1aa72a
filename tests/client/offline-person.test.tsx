import 'fake-indexeddb/auto';
import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createRoutes } from '../../client/src/app/router';
import { isWalkthroughEdit, type WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';
import { sharedWalkthroughQueue } from '../../client/src/features/walkthrough/sync/walkthrough-queue';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { personStores, resetPersonForTests, setCurrentPerson, type Person } from '../../client/src/lib/offline/person';
import { idbQueueStorage, type QueueItem } from '../../client/src/lib/offline/queue';
import { createQueryClient } from '../../client/src/lib/query-client';
import { bedroomInput, JOB_ID, ROOM_ID } from './helpers/walkthrough-harness';

/**
 * A shared tablet: what one person left waiting is stored under their company and id, never sent
 * under anyone else's session, and sent when they sign in again.
 */
const A: Person = { companyId: 'c1', userId: 'user-a' };
const B: Person = { companyId: 'c1', userId: 'user-b' };
// The queues are one per tab and person: each test below has people of its own.
const C: Person = { companyId: 'c1', userId: 'user-c' };
const D: Person = { companyId: 'c2', userId: 'user-d' };

const roomPath = `/api/jobs/${JOB_ID}/rooms/${ROOM_ID}`;

interface Call {
  method: string;
  url: string;
  headers: Record<string, string>;
}

/** fetch with no connection for writes (they throw like a dropped network) until `online` is set. */
function stubFetch(reply: (call: Call) => Response | null) {
  const calls: Call[] = [];
  let online = false;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
      const raw = init?.headers;
      const headers = raw && !(raw instanceof Headers) && !Array.isArray(raw) ? raw : {};
      const call = { method: init?.method ?? 'GET', url, headers };
      calls.push(call);
      if (call.method !== 'GET' && !online) throw new TypeError('Failed to fetch');
      const res = reply(call);
      if (!res) throw new Error(`Unexpected fetch: ${call.method} ${url}`);
      return res;
    }),
  );
  return {
    calls,
    writes: () => calls.filter((c) => c.method !== 'GET'),
    goOnline: () => {
      online = true;
    },
  };
}

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

const roomRecord = (version: number, name: string) => ({
  id: ROOM_ID,
  jobId: JOB_ID,
  position: 0,
  input: { ...bedroomInput, name },
  version,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  photos: [],
});

function edit(n: number, name: string): QueueItem<WalkthroughEdit> {
  return {
    id: `edit-${n}`,
    seq: n,
    target: `room:${ROOM_ID}`,
    baseVersion: 3,
    payload: { kind: 'room-update', jobId: JOB_ID, roomId: ROOM_ID, input: { ...bedroomInput, name } },
    queuedAt: '2026-01-01T00:00:00.000Z',
  };
}

const storedFor = (p: Person) => idbQueueStorage(isWalkthroughEdit, personStores(p).queue);

beforeEach(() => {
  clearCsrfToken();
  resetPersonForTests();
});
afterEach(() => {
  vi.unstubAllGlobals();
  resetPersonForTests();
});

describe('waiting edits belong to the person who made them', () => {
  it('B signing in neither sees nor sends A’s waiting edit; A signing in again sends it, naming A', async () => {
    const queryClient = createQueryClient();
    const net = stubFetch((c) =>
      c.url === '/api/auth/csrf' ? json(200, { token: 't' }) : json(200, { room: roomRecord(4, 'Den') }),
    );

    setCurrentPerson(A);
    const queueA = sharedWalkthroughQueue(queryClient);
    await waitFor(() => expect(queueA.getSnapshot().loaded).toBe(true));
    await queueA.enqueue({
      target: `room:${ROOM_ID}`,
      baseVersion: 3,
      payload: { kind: 'room-update', jobId: JOB_ID, roomId: ROOM_ID, input: { ...bedroomInput, name: 'Den' } },
    });
    await waitFor(() => expect(queueA.getSnapshot().online).toBe(false));
    expect(await storedFor(A).load()).toHaveLength(1);

    // A signs out (no connection); B signs in on the same tablet, and the connection is back.
    setCurrentPerson(B);
    net.goOnline();
    const queueB = sharedWalkthroughQueue(queryClient);
    expect(queueB).not.toBe(queueA);
    await waitFor(() => expect(queueB.getSnapshot().loaded).toBe(true));
    expect(queueB.getSnapshot().items).toEqual([]);
    await queueB.flush();
    await queueA.flush(); // A's queue stopped: nothing of it goes out under B's session
    expect(net.writes()).toHaveLength(1); // only the offline attempt made while A was signed in
    expect(await storedFor(B).load()).toEqual([]);
    expect(await storedFor(A).load()).toHaveLength(1);

    // A signs in again: the edit goes, carrying A's id so the server can refuse any other session.
    setCurrentPerson(A);
    const queueA2 = sharedWalkthroughQueue(queryClient);
    await waitFor(() => expect(queueA2.getSnapshot().items).toEqual([]));
    const sent = net.writes().at(-1);
    expect(sent).toMatchObject({ method: 'PATCH', url: roomPath });
    expect(sent?.headers['X-Gaugeline-Person']).toBe('user-a');
    expect(sent?.headers['If-Match']).toBe('"3"');
    await waitFor(async () => expect(await storedFor(A).load()).toEqual([]));
  });

  it('a replay the server refuses as another person’s is kept, and the queue says why', async () => {
    const queryClient = createQueryClient();
    const net = stubFetch((c) =>
      c.url === '/api/auth/csrf'
        ? json(200, { token: 't' })
        : new Response(
            JSON.stringify({
              type: '/problems/other-person',
              title: 'Forbidden',
              status: 403,
              detail: 'This change was made by another person on this device.',
            }),
            { status: 403, headers: { 'Content-Type': 'application/problem+json' } },
          ),
    );
    net.goOnline();
    await storedFor(C).save([edit(1, 'Den')]);
    setCurrentPerson(C);
    const queue = sharedWalkthroughQueue(queryClient);
    await waitFor(() => expect(queue.getSnapshot().blocked).toMatch(/Someone else is signed in/));
    expect(queue.getSnapshot().items).toHaveLength(1);
    expect(await storedFor(C).load()).toHaveLength(1);
  });
});

describe('signing out with changes waiting', () => {
  const company = { id: 'c2', name: 'Test Heating Co', unitSystem: 'imperial' };
  const user = {
    id: 'user-d',
    name: 'Pat Tester',
    email: 'pat@example.com',
    role: 'salesperson',
    active: true,
    companyId: 'c2',
    createdAt: '2026-01-01T00:00:00.000Z',
  };

  it('asks first; "Stay signed in" keeps the session, "Sign out anyway" signs out and keeps the changes', async () => {
    await storedFor(D).save([edit(1, 'Den'), edit(2, 'Study'), { ...edit(3, 'Nook'), target: 'room:other' }]);
    const net = stubFetch((c) => {
      if (c.url === '/api/auth/session') return json(200, { me: { user, company } });
      if (c.url === '/api/auth/csrf') return json(200, { token: 't' });
      if (c.url === '/api/auth/logout') return new Response(null, { status: 204 });
      return null;
    });
    const leave = vi.fn();
    vi.stubGlobal('location', { ...window.location, assign: leave });
    const queryClient = createQueryClient();
    const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: ['/'] });
    render(
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>,
    );
    await screen.findByRole('heading', { name: 'Hello, Pat' }, { timeout: 5000 });
    // The three stored edits are loaded and tried (no connection: they stay).
    await waitFor(() => expect(net.writes().length).toBeGreaterThan(0), { timeout: 5000 });
    fireEvent.click(screen.getByRole('button', { name: 'Sign out' }));
    expect(screen.getByText('3 changes have not reached the office — sign out anyway?')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Stay signed in' })).toHaveFocus();
    fireEvent.click(screen.getByRole('button', { name: 'Stay signed in' }));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    expect(net.calls.some((c) => c.url === '/api/auth/logout')).toBe(false);

    fireEvent.click(screen.getByRole('button', { name: 'Sign out' }));
    net.goOnline(); // the logout itself must get through; the edits stay
    fireEvent.click(await screen.findByRole('button', { name: 'Sign out anyway' }, { timeout: 5000 }));
    await waitFor(() => expect(net.calls.some((c) => c.url === '/api/auth/logout')).toBe(true), { timeout: 5000 });
    expect(await storedFor(D).load()).toHaveLength(3);
  });
});
