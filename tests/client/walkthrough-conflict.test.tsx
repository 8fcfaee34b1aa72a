import { fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ConflictPanel } from '../../client/src/features/walkthrough/components/conflict-panel';
import { roomTarget } from '../../client/src/features/walkthrough/sync/edits';
import { useQueueState } from '../../client/src/features/walkthrough/sync/queue-context';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import type { RoomRecord } from '@contract';
import { createQueryClient } from '../../client/src/lib/query-client';
import { deviceLabel } from '../../client/src/lib/device';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';
import { bedroomInput, JOB_ID, renderWalkthrough, ROOM_ID, roomRecord } from './helpers/walkthrough-harness';

const roomUrl = `/api/jobs/${JOB_ID}/rooms/${ROOM_ID}`;
const mine = { ...bedroomInput, lengthFt: 14 };
const theirs = { ...bedroomInput, name: 'Den', lengthFt: 13 };

function ConflictHost() {
  const state = useQueueState();
  return state.conflict ? <ConflictPanel item={state.conflict} onResolved={() => undefined} /> : <p>No conflict</p>;
}

function bodyOf(init: RequestInit | undefined): unknown {
  return typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
}

beforeEach(() => {
  clearCsrfToken();
});
afterEach(() => vi.unstubAllGlobals());

/** When and where the other change was made, as the server tells it (contract lastChangeRecord). */
const changedAt = new Date();
changedAt.setHours(14, 32, 0, 0);
const stamp = (device: string | null) => ({
  updatedAt: changedAt.toISOString(),
  lastChange: { byName: 'Wren Halloway', device },
});

async function setUp(lastChange: ReturnType<typeof stamp> | Record<string, never> = {}) {
  const patches: RequestInit[] = [];
  const fetchMock = mockFetch({
    'GET /api/auth/csrf': json(200, { token: 't' }),
    [`GET ${roomUrl}`]: json(200, { room: { ...roomRecord(theirs, 5), ...lastChange } }),
    [`PATCH ${roomUrl}`]: (init, call) => {
      patches.push(init ?? {});
      if (call === 1) return problem(409, 'conflict', 'The room was changed by someone else.', { currentVersion: 5 });
      const sent = bodyOf(init);
      const input = typeof sent === 'object' && sent !== null && 'input' in sent ? sent.input : {};
      return json(200, { room: roomRecord(typeof input === 'object' && input !== null ? { ...input } : {}, 6) });
    },
  });
  const queryClient = createQueryClient();
  queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
  const harness = await renderWalkthrough(<ConflictHost />, { send: 'real', queryClient });
  await harness.queue.enqueue({
    target: roomTarget(ROOM_ID),
    baseVersion: 3,
    payload: { kind: 'room-update', jobId: JOB_ID, roomId: ROOM_ID, input: mine },
  });
  await screen.findByRole('region', { name: 'Resolve conflicting changes' });
  return { ...harness, patches, fetchMock, queryClient };
}

const cached = (q: ReturnType<typeof createQueryClient>) => q.getQueryData<RoomRecord[]>(jobKeys.rooms(JOB_ID))?.[0];

describe('conflict on a room', () => {
  it('shows yours and theirs for each field that differs', async () => {
    const { patches } = await setUp();
    expect(headerOf(patches[0], 'If-Match')).toBe('"3"');
    // Every write names this browser's device label, which the server keeps with the record.
    expect(headerOf(patches[0], 'X-Gaugeline-Device')).toBe(deviceLabel());
    const name = screen.getByRole('group', { name: 'Room name' });
    expect(name).toHaveTextContent('Yours');
    expect(name).toHaveTextContent('Bedroom 2');
    expect(name).toHaveTextContent('Den');
    const length = screen.getByRole('group', { name: 'Length (ft)' });
    expect(length).toHaveTextContent('14');
    expect(length).toHaveTextContent('13');
    expect(screen.queryByRole('group', { name: 'Width (ft)' })).toBeNull();
  });

  it('says on which device, when and by whom the other change was made', async () => {
    await setUp(stamp('desk-7f3a9c21e0b4'));
    const time = changedAt.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
    const panel = screen.getByRole('region', { name: 'Resolve conflicting changes' });
    expect(panel).toHaveTextContent(`Changed on another device at ${time} by Wren Halloway.`);
    expect(panel).toHaveTextContent('“Den” was changed meanwhile');
  });

  it('an edit from another tab of this browser reads “on this device”', async () => {
    await setUp(stamp(deviceLabel()));
    expect(screen.getByRole('region', { name: 'Resolve conflicting changes' })).toHaveTextContent(
      /Changed on this device at .+ by Wren Halloway\./,
    );
  });

  it('a record changed before stamps were kept still gives the time', async () => {
    await setUp();
    // roomRecord's updatedAt is 1 January 2026: another day, so the date comes first (in the browser's locale).
    const at = new Date('2026-01-01T00:00:00.000Z');
    const day = at.toLocaleDateString([], { day: 'numeric', month: 'short' });
    const time = at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
    expect(screen.getByRole('region', { name: 'Resolve conflicting changes' })).toHaveTextContent(
      `Changed on ${day} at ${time}. Choose`,
    );
  });

  it('writes the chosen mix with the server’s new version', async () => {
    const { patches, queue, queryClient } = await setUp();
    fireEvent.click(screen.getByLabelText('Length (ft): keep theirs'));
    fireEvent.click(screen.getByRole('button', { name: 'Save my choices' }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect(headerOf(patches[1], 'If-Match')).toBe('"5"');
    expect(bodyOf(patches[1])).toMatchObject({ input: { name: 'Bedroom 2', lengthFt: 13 } });
    await waitFor(() => expect(queue.getSnapshot().items).toHaveLength(0));
    expect(cached(queryClient)).toMatchObject({ version: 6, input: { name: 'Bedroom 2', lengthFt: 13 } });
    expect(await screen.findByText('No conflict')).toBeInTheDocument();
  });

  it('keeps all mine with one tap', async () => {
    const { patches } = await setUp();
    fireEvent.click(screen.getByRole('button', { name: 'Keep all mine' }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect(bodyOf(patches[1])).toMatchObject({ input: { name: 'Bedroom 2', lengthFt: 14 } });
  });

  it('keeping theirs writes nothing and shows their version', async () => {
    const { patches, queue, queryClient } = await setUp();
    fireEvent.click(screen.getByRole('button', { name: 'Keep all theirs' }));
    await waitFor(() => expect(queue.getSnapshot().conflict).toBeNull());
    expect(queue.getSnapshot().items).toHaveLength(0);
    expect(patches).toHaveLength(1);
    expect(cached(queryClient)).toMatchObject({ version: 5, input: { name: 'Den' } });
  });
});
