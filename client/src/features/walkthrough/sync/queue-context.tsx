import { useQueryClient } from '@tanstack/react-query';
import { createContext, useContext, useSyncExternalStore, type ReactNode } from 'react';
import { useCurrentPerson } from '../../../lib/offline/person';
import type { QueueState } from '../../../lib/offline/queue';
import type { WalkthroughEdit } from './edits';
import { sharedWalkthroughQueue, type WalkthroughQueue } from './walkthrough-queue';

const QueueContext = createContext<WalkthroughQueue | null>(null);

/** Tests hand in their own queue (memory storage, fake sender). */
export function WalkthroughQueueProvider({ queue, children }: { queue: WalkthroughQueue; children: ReactNode }) {
  return <QueueContext.Provider value={queue}>{children}</QueueContext.Provider>;
}

export function useWalkthroughQueue(): WalkthroughQueue {
  const injected = useContext(QueueContext);
  // Another person signing in on this tab swaps the queue: re-render with theirs.
  useCurrentPerson();
  const queryClient = useQueryClient();
  return injected ?? sharedWalkthroughQueue(queryClient);
}

export function useQueueState(): QueueState<WalkthroughEdit> {
  const queue = useWalkthroughQueue();
  return useSyncExternalStore(queue.subscribe, queue.getSnapshot, queue.getSnapshot);
}
