import type { QueryClient } from '@tanstack/react-query';
import { personStores } from '../../../lib/offline/person';
import { perPerson } from '../../../lib/offline/use-offline-queue';
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

/**
 * The signed-in person's queue (lib/offline/use-offline-queue.ts: one per tab and person, started
 * on first use, so it survives moving between jobs; another person's stops and stays stored).
 */
export const sharedWalkthroughQueue = perPerson((person, queryClient: QueryClient) =>
  createWalkthroughQueue(
    queryClient,
    // Nobody known yet (a loader running before the sign-in check): memory only, never stored.
    person ? idbQueueStorage(isWalkthroughEdit, personStores(person).queue) : memoryQueueStorage<WalkthroughEdit>(),
    15_000,
    person?.userId,
  ),
);
