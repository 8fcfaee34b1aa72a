import type { QueryClient } from '@tanstack/react-query';
import { getCurrentPerson, personKey, personStores } from '../../../lib/offline/person';
import { idbQueueStorage, memoryQueueStorage, type QueueStorage } from '../../../lib/offline/queue';
import { OfflineQueue } from '../../../lib/offline/queue-runner';
import { coalesceEdits, isWalkthroughEdit, type WalkthroughEdit } from './edits';
import { createEditSender } from './send-edit';

export type WalkthroughQueue = OfflineQueue<WalkthroughEdit>;

export function createWalkthroughQueue(
  queryClient: QueryClient,
  storage: QueueStorage<WalkthroughEdit>,
  retryMs = 15_000,
  person?: string,
): WalkthroughQueue {
  return new OfflineQueue<WalkthroughEdit>({
    storage,
    send: createEditSender(queryClient, person),
    coalesce: coalesceEdits,
    retryMs,
  });
}

let shared: { readonly key: string; readonly queue: WalkthroughQueue } | null = null;

/**
 * The signed-in person's queue, started on first use: one per tab, it survives moving between
 * jobs. When another person signs in on this tab, the previous person's queue stops (its edits
 * stay in their own store) and this person's is loaded from theirs.
 */
export function sharedWalkthroughQueue(queryClient: QueryClient): WalkthroughQueue {
  const person = getCurrentPerson();
  const key = person ? personKey(person) : '';
  if (shared?.key !== key) {
    shared?.queue.stop();
    // Nobody known yet (a loader running before the sign-in check): memory only, never stored.
    const storage = person
      ? idbQueueStorage(isWalkthroughEdit, personStores(person).queue)
      : memoryQueueStorage<WalkthroughEdit>();
    const queue = createWalkthroughQueue(queryClient, storage, 15_000, person?.userId);
    shared = { key, queue };
    void queue.start();
  }
  return shared.queue;
}
