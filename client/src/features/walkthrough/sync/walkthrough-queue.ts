import type { QueryClient } from '@tanstack/react-query';
import { idbQueueStorage, type QueueStorage } from '../../../lib/offline-queue';
import { OfflineQueue } from '../../../lib/offline-queue-runner';
import { coalesceEdits, isWalkthroughEdit, type WalkthroughEdit } from './edits';
import { createEditSender } from './send-edit';

export type WalkthroughQueue = OfflineQueue<WalkthroughEdit>;

export function createWalkthroughQueue(
  queryClient: QueryClient,
  storage: QueueStorage<WalkthroughEdit> = idbQueueStorage(isWalkthroughEdit),
  retryMs = 15_000,
): WalkthroughQueue {
  return new OfflineQueue<WalkthroughEdit>({
    storage,
    send: createEditSender(queryClient),
    coalesce: coalesceEdits,
    retryMs,
  });
}

let shared: WalkthroughQueue | null = null;

/** One queue per tab, started on first use: it survives moving between jobs. */
export function sharedWalkthroughQueue(queryClient: QueryClient): WalkthroughQueue {
  if (!shared) {
    shared = createWalkthroughQueue(queryClient);
    void shared.start();
  }
  return shared;
}
