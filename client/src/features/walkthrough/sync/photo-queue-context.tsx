import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createContext, useContext, useSyncExternalStore, type ReactNode } from 'react';
import { PhotoQueue, type PhotoQueueOptions, type PhotoQueueState } from './photo-queue';
import { idbPhotoStorage } from './photo-storage';
import { useWalkthroughQueue } from './queue-context';
import { createPhotoSender, roomOnServer } from './send-photo';
import type { WalkthroughQueue } from './walkthrough-queue';

type Overrides = Partial<Omit<PhotoQueueOptions, 'send' | 'roomReady'>>;

/** The app's photo queue: uploads through the API and retries whenever a room may just have reached the server. */
export function createPhotoQueue(
  queryClient: QueryClient,
  edits: WalkthroughQueue,
  overrides: Overrides = {},
): PhotoQueue {
  const queue = new PhotoQueue({
    storage: overrides.storage ?? idbPhotoStorage(),
    send: createPhotoSender(queryClient),
    roomReady: roomOnServer(queryClient, edits),
    ...overrides,
  });
  const retry = () => {
    if (queue.getSnapshot().waiting.length > 0) void queue.flush();
  };
  queryClient.getQueryCache().subscribe((event) => {
    if (event.type === 'updated' && event.query.queryKey.at(-1) === 'rooms') retry();
  });
  // A create sent or dropped changes which rooms are ready.
  edits.subscribe(retry);
  return queue;
}

let shared: PhotoQueue | null = null;

function sharedPhotoQueue(queryClient: QueryClient, edits: WalkthroughQueue): PhotoQueue {
  if (!shared) {
    shared = createPhotoQueue(queryClient, edits);
    void shared.start();
  }
  return shared;
}

const PhotoQueueContext = createContext<PhotoQueue | null>(null);

/** Tests hand in their own queue (memory storage). */
export function PhotoQueueProvider({ queue, children }: { queue: PhotoQueue; children: ReactNode }) {
  return <PhotoQueueContext.Provider value={queue}>{children}</PhotoQueueContext.Provider>;
}

export function usePhotoQueue(): PhotoQueue {
  const injected = useContext(PhotoQueueContext);
  const queryClient = useQueryClient();
  const edits = useWalkthroughQueue();
  return injected ?? sharedPhotoQueue(queryClient, edits);
}

export function usePhotoQueueState(): PhotoQueueState {
  const queue = usePhotoQueue();
  return useSyncExternalStore(queue.subscribe, queue.getSnapshot, queue.getSnapshot);
}
