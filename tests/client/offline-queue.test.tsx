import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  memoryQueueStorage,
  type QueueItem,
  type QueueStorage,
  type SendResult,
} from '../../client/src/lib/offline/queue';
import { OfflineQueue } from '../../client/src/lib/offline/queue-runner';
import { coalesceEdits, roomTarget, type WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';

type Edit = WalkthroughEdit;
const update = (roomId: string, name: string): Edit => ({
  kind: 'room-update',
  jobId: 'j1',
  roomId,
  input: { id: roomId, name },
});

/** Storage that, like IndexedDB, keeps a structured copy — so a "reload" sees only what was written. */
function durableStorage(): QueueStorage<Edit> & { items: () => QueueItem<Edit>[] } {
  let stored = '[]';
  return {
    load: async () => JSON.parse(stored),
    save: async (items) => {
      stored = JSON.stringify(items);
    },
    items: () => JSON.parse(stored),
  };
}

function makeQueue(opts: {
  storage?: QueueStorage<Edit>;
  send: (item: QueueItem<Edit>) => Promise<SendResult>;
  online?: () => boolean;
}) {
  let n = 0;
  return new OfflineQueue<Edit>({
    storage: opts.storage ?? memoryQueueStorage<Edit>(),
    send: opts.send,
    coalesce: coalesceEdits,
    isOnline: opts.online ?? (() => true),
    retryMs: 0,
    newId: () => `e${++n}`,
  });
}

const queues: OfflineQueue<Edit>[] = [];
afterEach(() => {
  for (const q of queues.splice(0)) q.stop();
});
async function started(q: OfflineQueue<Edit>) {
  queues.push(q);
  await q.start();
  return q;
}

describe('offline queue', () => {
  it('sends edits one at a time in the order they were made', async () => {
    const sent: string[] = [];
    const q = await started(
      makeQueue({
        send: async (i) => (
          sent.push(`${i.target}:${String(i.payload.kind === 'room-update' ? i.payload.input.name : '')}`),
          { kind: 'ok', version: 2 }
        ),
      }),
    );
    await q.enqueue({ target: roomTarget('a'), baseVersion: 1, payload: update('a', 'Kitchen') });
    await q.enqueue({ target: roomTarget('b'), baseVersion: 1, payload: update('b', 'Den') });
    await q.enqueue({ target: roomTarget('c'), baseVersion: 1, payload: update('c', 'Hall') });
    await vi.waitFor(() => expect(q.getSnapshot().items).toHaveLength(0));
    expect(sent).toEqual(['room:a:Kitchen', 'room:b:Den', 'room:c:Hall']);
  });

  it('holds edits while offline and replays them in order when the connection returns', async () => {
    let online = false;
    const sent: string[] = [];
    const q = await started(
      makeQueue({ online: () => online, send: async (i) => (sent.push(i.target), { kind: 'ok', version: 2 }) }),
    );
    await q.enqueue({ target: roomTarget('a'), baseVersion: 1, payload: update('a', 'One') });
    await q.enqueue({ target: roomTarget('b'), baseVersion: 1, payload: update('b', 'Two') });
    await q.flush();
    expect(sent).toEqual([]);
    expect(q.getSnapshot()).toMatchObject({ online: false });
    expect(q.getSnapshot().items.map((i) => i.target)).toEqual(['room:a', 'room:b']);

    online = true;
    window.dispatchEvent(new Event('online'));
    await vi.waitFor(() => expect(sent).toEqual(['room:a', 'room:b']));
    expect(q.getSnapshot().items).toHaveLength(0);
  });

  it('keeps waiting edits across a reload, in order, and sends them after it', async () => {
    const storage = durableStorage();
    let online = false;
    const first = await started(makeQueue({ storage, online: () => online, send: async () => ({ kind: 'network' }) }));
    await first.enqueue({ target: roomTarget('a'), baseVersion: 4, payload: update('a', 'Bedroom') });
    await first.enqueue({ target: roomTarget('b'), baseVersion: 7, payload: update('b', 'Office') });
    first.stop();
    expect(storage.items().map((i) => i.target)).toEqual(['room:a', 'room:b']);

    // A new page: a new queue reading the same storage.
    online = true;
    const sent: QueueItem<Edit>[] = [];
    const second = await started(
      makeQueue({ storage, online: () => online, send: async (i) => (sent.push(i), { kind: 'ok', version: 9 }) }),
    );
    await vi.waitFor(() => expect(sent).toHaveLength(2));
    expect(sent.map((i) => [i.target, i.baseVersion])).toEqual([
      ['room:a', 4],
      ['room:b', 7],
    ]);
    await vi.waitFor(() => expect(storage.items()).toEqual([]));
    expect(second.getSnapshot().items).toEqual([]);
  });

  it('keeps an edit that failed on the network and sends it on the next try', async () => {
    const results: SendResult[] = [{ kind: 'network' }, { kind: 'ok', version: 3 }];
    const send = vi.fn(async (): Promise<SendResult> => results.shift() ?? { kind: 'ok', version: 3 });
    const q = await started(makeQueue({ send }));
    await q.enqueue({ target: roomTarget('a'), baseVersion: 2, payload: update('a', 'Den') });
    await vi.waitFor(() => expect(q.getSnapshot().online).toBe(false));
    expect(q.getSnapshot().items).toHaveLength(1);
    await q.flush();
    expect(send).toHaveBeenCalledTimes(2);
    expect(q.getSnapshot().items).toHaveLength(0);
  });

  it('sends a later edit of the same room on the version the earlier one produced', async () => {
    const sent: (number | null)[] = [];
    const gate: { release?: () => void } = {};
    const q = await started(
      makeQueue({
        send: (i) => {
          sent.push(i.baseVersion);
          if (sent.length === 1)
            return new Promise((resolve) => (gate.release = () => resolve({ kind: 'ok', version: 4 })));
          return Promise.resolve({ kind: 'ok', version: 5 });
        },
      }),
    );
    await q.enqueue({ target: roomTarget('a'), baseVersion: 3, payload: update('a', 'First') });
    await vi.waitFor(() => expect(gate.release).toBeDefined());
    // Typed while the first save is on its way: made against version 3 too.
    await q.enqueue({ target: roomTarget('a'), baseVersion: 3, payload: update('a', 'Second') });
    gate.release?.();
    await vi.waitFor(() => expect(sent).toEqual([3, 4]));
  });

  it('folds waiting edits of one room into one, and a create then delete into nothing', async () => {
    const q = await started(makeQueue({ online: () => false, send: async () => ({ kind: 'ok', version: 1 }) }));
    await q.enqueue({
      target: roomTarget('a'),
      baseVersion: null,
      payload: { kind: 'room-create', jobId: 'j1', roomId: 'a', position: 0, input: { id: 'a', name: 'New' } },
    });
    await q.enqueue({ target: roomTarget('b'), baseVersion: 2, payload: update('b', 'B1') });
    await q.enqueue({ target: roomTarget('a'), baseVersion: null, payload: update('a', 'Renamed') });
    await q.enqueue({ target: roomTarget('b'), baseVersion: 2, payload: update('b', 'B2') });
    const items = q.getSnapshot().items;
    expect(items.map((i) => i.payload.kind)).toEqual(['room-create', 'room-update']);
    expect(items[0]?.payload).toMatchObject({ kind: 'room-create', input: { name: 'Renamed' } });
    expect(items[1]?.payload).toMatchObject({ input: { name: 'B2' } });
    await q.enqueue({
      target: roomTarget('a'),
      baseVersion: null,
      payload: { kind: 'room-delete', jobId: 'j1', roomId: 'a' },
    });
    expect(q.getSnapshot().items.map((i) => i.target)).toEqual(['room:b']);
  });

  it('stops at a conflict until the person chooses, then sends the choice on the server version', async () => {
    const results: SendResult[] = [{ kind: 'conflict' }, { kind: 'ok', version: 8 }];
    const sent: QueueItem<Edit>[] = [];
    const q = await started(
      makeQueue({ send: async (i) => (sent.push(i), results.shift() ?? { kind: 'ok', version: 8 }) }),
    );
    await q.enqueue({ target: roomTarget('a'), baseVersion: 5, payload: update('a', 'Mine') });
    await q.enqueue({ target: roomTarget('b'), baseVersion: 1, payload: update('b', 'Other') });
    await vi.waitFor(() => expect(q.getSnapshot().conflict?.target).toBe('room:a'));
    expect(sent).toHaveLength(1);

    const conflict = q.getSnapshot().conflict;
    if (!conflict) throw new Error('expected a conflict');
    await q.resolveConflict(conflict.id, { payload: update('a', 'Merged'), baseVersion: 7 });
    await vi.waitFor(() => expect(q.getSnapshot().items).toHaveLength(0));
    expect(sent.slice(1).map((i) => [i.target, i.baseVersion])).toEqual([
      ['room:a', 7],
      ['room:b', 1],
    ]);
    expect(sent[1]?.payload).toMatchObject({ input: { name: 'Merged' } });
  });

  it('drops an edit the server refuses outright and says why', async () => {
    const q = await started(
      makeQueue({ send: async () => ({ kind: 'rejected', message: 'Length must be between 1 and 200 ft' }) }),
    );
    await q.enqueue({ target: roomTarget('a'), baseVersion: 1, payload: update('a', 'X') });
    await vi.waitFor(() => expect(q.getSnapshot().rejected).toBe('Length must be between 1 and 200 ft'));
    expect(q.getSnapshot().items).toHaveLength(0);
  });

  it('puts an edit made with a stale version (its own write just landed) on the version that write reached', async () => {
    // Seen in the browser: the debounce fired between the create's answer and the next render,
    // so the editor still said "no version" and the update went out without If-Match (428).
    const sent: Array<number | null> = [];
    const q = await started(
      makeQueue({
        send: async (i) => (
          sent.push(i.baseVersion),
          { kind: 'ok', version: i.payload.kind === 'room-create' ? 1 : (i.baseVersion ?? 0) + 1 }
        ),
      }),
    );
    await q.enqueue({
      target: roomTarget('r'),
      baseVersion: null,
      payload: { kind: 'room-create', jobId: 'j1', roomId: 'r', position: 0, input: { id: 'r', name: 'Den' } },
    });
    await vi.waitFor(() => expect(q.getSnapshot().items).toHaveLength(0));
    await q.enqueue({ target: roomTarget('r'), baseVersion: null, payload: update('r', 'Den renamed') });
    await vi.waitFor(() => expect(q.getSnapshot().items).toHaveLength(0));
    await q.enqueue({ target: roomTarget('r'), baseVersion: 1, payload: update('r', 'Den again') });
    await vi.waitFor(() => expect(q.getSnapshot().items).toHaveLength(0));
    expect(sent).toEqual([null, 1, 2]);
  });
});
