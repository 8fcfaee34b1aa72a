import { afterEach, describe, expect, it, vi } from 'vitest';
import { roomTarget, type WalkthroughItem } from '../../client/src/features/walkthrough/sync/edits';
import { createEditSender } from '../../client/src/features/walkthrough/sync/send-edit';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { roomsQueryOptions } from '../../client/src/entities/job/queries';
import type { RoomRecord } from '@contract';
import { createQueryClient } from '../../client/src/lib/query-client';
import { bedroomInput, JOB_ID, roomRecord } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

const NEW_ID = '44444444-4444-4444-8444-444444444444';
const newRoom = { ...roomRecord({ ...bedroomInput, id: NEW_ID, name: 'Den' }, 1), id: NEW_ID, position: 1 };
const create: WalkthroughItem = {
  id: 'e1',
  seq: 1,
  target: roomTarget(NEW_ID),
  baseVersion: null,
  queuedAt: '2026-01-01T00:00:00.000Z',
  payload: { kind: 'room-create', jobId: JOB_ID, roomId: NEW_ID, position: 1, input: newRoom.input },
};

/** A server whose rooms list is answered when the test says (as it stood before the create), and whose create answers at once. */
function server() {
  const lists: Array<(rooms: RoomRecord[]) => void> = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      if (url === '/api/auth/csrf') return Response.json({ token: 't' });
      if (method === 'GET' && url === `/api/jobs/${JOB_ID}/rooms`) {
        const rooms = await new Promise<RoomRecord[]>((resolve) => lists.push(resolve));
        return Response.json({ rooms });
      }
      if (method === 'POST') return Response.json({ room: newRoom }, { status: 201, headers: { ETag: '"1"' } });
      throw new Error(`Unexpected fetch: ${method} ${url}`);
    }),
  );
  return { answerList: (rooms: RoomRecord[]) => lists.shift()?.(rooms), listsAsked: () => lists.length };
}

const names = (rooms: RoomRecord[] | undefined) => rooms?.map((r) => r.input.name);

describe('a write answered while a rooms fetch is on its way', () => {
  it('keeps the new room when a refetch answered before the create arrives after it', async () => {
    const s = server();
    const queryClient = createQueryClient();
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
    const refetch = queryClient.fetchQuery({ ...roomsQueryOptions(JOB_ID), staleTime: 0 });
    await vi.waitFor(() => expect(s.listsAsked()).toBe(1));
    await expect(createEditSender(queryClient)(create)).resolves.toEqual({ kind: 'ok', version: 1 });
    // The list the server gave before the create committed comes back now: it must not win.
    s.answerList([roomRecord(bedroomInput, 3)]);
    await refetch.catch(() => undefined);
    await new Promise((r) => setTimeout(r, 10));
    expect(names(queryClient.getQueryData(jobKeys.rooms(JOB_ID)))).toEqual(['Bedroom 2', 'Den']);
  });

  it('never makes up a list of one room when no list is held: it takes the whole list, then adds the answer', async () => {
    const s = server();
    const queryClient = createQueryClient();
    // The page's first fetch left before the create committed and is still on its way.
    const first = queryClient.fetchQuery(roomsQueryOptions(JOB_ID));
    await vi.waitFor(() => expect(s.listsAsked()).toBe(1));
    await createEditSender(queryClient)(create);
    expect(queryClient.getQueryData(jobKeys.rooms(JOB_ID))).toBeUndefined();
    s.answerList([roomRecord(bedroomInput, 3)]);
    await first;
    await vi.waitFor(() =>
      expect(names(queryClient.getQueryData(jobKeys.rooms(JOB_ID)))).toEqual(['Bedroom 2', 'Den']),
    );
  });

  it('keeps a newer version of the room the list already holds', async () => {
    server();
    const queryClient = createQueryClient();
    const newer = { ...newRoom, version: 5, input: { ...newRoom.input, name: 'Den (renamed later)' } };
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3), newer]);
    await createEditSender(queryClient)(create);
    expect(names(queryClient.getQueryData(jobKeys.rooms(JOB_ID)))).toEqual(['Bedroom 2', 'Den (renamed later)']);
  });
});
