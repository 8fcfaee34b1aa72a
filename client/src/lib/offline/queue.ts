import { get, set, type UseStore } from 'idb-keyval';

/**
 * An ordered, persisted queue of writes: the one path every autosaved edit takes, online
 * or not. Each edit is written to storage before it is sent, sent one at a time in the
 * order it was made, and removed only when the server accepted it — so a dropped
 * connection or a reload loses nothing. What an edit means is the caller's business
 * (`send` and `coalesce`); the queue only keeps order, versions and state.
 */

export interface QueueItem<P> {
  readonly id: string;
  /** Monotonic order of creation; replay goes by it. */
  readonly seq: number;
  /** What the edit writes ("room:<id>", "job:<id>"): versions chain per target. */
  readonly target: string;
  /** The version of the target the edit was made against (If-Match); null for a create. */
  readonly baseVersion: number | null;
  readonly payload: P;
  readonly queuedAt: string;
}

export type NewItem<P> = Pick<QueueItem<P>, 'target' | 'baseVersion' | 'payload'>;

export type SendResult =
  | { readonly kind: 'ok'; readonly version: number | null }
  | { readonly kind: 'network' }
  | { readonly kind: 'conflict' }
  /** Cannot be sent now but must not be lost (signed out): keep it, stop, say why. */
  | { readonly kind: 'blocked'; readonly message: string }
  | { readonly kind: 'rejected'; readonly message: string };

/** Merge a new edit into a still-waiting one of the same target, 'drop-both', or null to append. */
export type Coalesce<P> = (waiting: QueueItem<P>, next: NewItem<P>) => QueueItem<P> | 'drop-both' | null;

export interface QueueStorage<P> {
  load(): Promise<QueueItem<P>[]>;
  save(items: readonly QueueItem<P>[]): Promise<void>;
}

export interface QueueState<P> {
  readonly loaded: boolean;
  readonly online: boolean;
  readonly sending: boolean;
  readonly items: readonly QueueItem<P>[];
  /** The head item the server refused with 409; the queue waits until it is resolved. */
  readonly conflict: QueueItem<P> | null;
  /** The last edit the server refused outright (dropped), in its words. */
  readonly rejected: string | null;
  /** Why sending is paused with edits kept (e.g. the session ended); cleared by the next success. */
  readonly blocked: string | null;
}

export const QUEUE_STORAGE_KEY = 'gaugeline:offline-queue:v1';

/** The stored list is read back as written by this file; anything else (an old format) is skipped. */
function isStoredItem(v: unknown): v is QueueItem<unknown> {
  if (typeof v !== 'object' || v === null) return false;
  const r: Record<string, unknown> = { ...v };
  return (
    typeof r.id === 'string' &&
    typeof r.seq === 'number' &&
    typeof r.target === 'string' &&
    typeof r.payload === 'object' &&
    r.payload !== null
  );
}

/**
 * IndexedDB storage through idb-keyval, in the person's own store (lib/offline/person.ts).
 * `isPayload` checks each stored edit (the queue cannot know what its payloads are).
 */
export function idbQueueStorage<P>(
  isPayload: (v: unknown) => v is P,
  db: UseStore,
  key: string = QUEUE_STORAGE_KEY,
): QueueStorage<P> {
  return {
    load: async () => {
      const v: unknown = await get(key, db);
      if (!Array.isArray(v)) return [];
      return v.flatMap((item: unknown): QueueItem<P>[] => {
        if (!isStoredItem(item)) return [];
        const { payload } = item;
        return isPayload(payload)
          ? [{ ...item, payload, baseVersion: typeof item.baseVersion === 'number' ? item.baseVersion : null }]
          : [];
      });
    },
    save: (items) => set(key, items, db),
  };
}

export function memoryQueueStorage<P>(
  initial: readonly QueueItem<P>[] = [],
): QueueStorage<P> & { readonly saved: () => readonly QueueItem<P>[] } {
  let items = [...initial];
  return {
    load: async () => [...items],
    save: async (next) => {
      items = [...next];
    },
    saved: () => items,
  };
}

export interface OfflineQueueOptions<P> {
  storage: QueueStorage<P>;
  send: (item: QueueItem<P>) => Promise<SendResult>;
  coalesce?: Coalesce<P>;
  /** Called after the server accepted an item (update caches here). */
  onSent?: (item: QueueItem<P>, version: number | null) => void;
  isOnline?: () => boolean;
  retryMs?: number;
  newId?: () => string;
  now?: () => Date;
}
