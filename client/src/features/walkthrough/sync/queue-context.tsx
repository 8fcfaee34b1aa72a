import { useQueryClient } from '@tanstack/react-query';
import { createContext, useContext, type ReactNode } from 'react';
import { useOfflineQueue } from '../../../lib/offline/use-offline-queue';
import type { QueueState } from '../../../lib/offline/queue';
import { JobEditsProvider } from '../../../entities/job/job-edits';
import type { WalkthroughEdit } from './edits';
import { useWalkthroughJobEdits } from './job-edits';
import { sharedWalkthroughQueue, type WalkthroughQueue } from './walkthrough-queue';

const QueueContext = createContext<WalkthroughQueue | null>(null);

/** Tests hand in their own queue (memory storage, fake sender); the job screens' edits go through it too. */
export function WalkthroughQueueProvider({ queue, children }: { queue: WalkthroughQueue; children: ReactNode }) {
  return (
    <QueueContext.Provider value={queue}>
      <JobEditsProvider useEdits={useWalkthroughJobEdits}>{children}</JobEditsProvider>
    </QueueContext.Provider>
  );
}

export function useWalkthroughQueue(): WalkthroughQueue {
  const injected = useContext(QueueContext);
  const queryClient = useQueryClient();
  // Another person signing in on this tab swaps the queue: useOfflineQueue re-renders with theirs.
  return useOfflineQueue<QueueState<WalkthroughEdit>, WalkthroughQueue>(injected ?? sharedWalkthroughQueue(queryClient))
    .runner;
}

export function useQueueState(): QueueState<WalkthroughEdit> {
  return useOfflineQueue<QueueState<WalkthroughEdit>, WalkthroughQueue>(useWalkthroughQueue()).state;
}
