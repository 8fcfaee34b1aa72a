import { useQueryClient } from '@tanstack/react-query';
import type { QueueState } from '../../lib/offline/queue';
import { useOfflineQueue } from '../../lib/offline/use-offline-queue';
import { LoadsPage } from '../loads/components/loads-page';
import type { WalkthroughEdit } from '../walkthrough/sync/edits';
import { sharedWalkthroughQueue, type WalkthroughQueue } from '../walkthrough/sync/walkthrough-queue';
import { JobsListPage } from './components/jobs-list-page';

/**
 * The jobs list and loads pages with the number of changes kept on this device for the signed-in
 * person, so that with no signal they can say what is still waiting (composed here, with routes.tsx).
 */
function useWaiting(): number {
  const { state } = useOfflineQueue<QueueState<WalkthroughEdit>, WalkthroughQueue>(
    sharedWalkthroughQueue(useQueryClient()),
  );
  return state.items.length;
}

export function JobsListRoute() {
  return <JobsListPage waiting={useWaiting()} />;
}

export function LoadsRoute() {
  return <LoadsPage waiting={useWaiting()} />;
}
