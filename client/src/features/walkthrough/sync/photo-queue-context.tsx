import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createContext, useContext, type ReactNode } from 'react';
import { FileQueue, type FileQueueOptions, type FileQueueState } from '../../../lib/offline/file-queue';
import { personStores } from '../../../lib/offline/person';
import { perPerson, useOfflineQueue } from '../../../lib/offline/use-offline-queue';
import { idbFileStorage, memoryFileStorage } from '../../../lib/offline/file-storage';
import { useWalkthroughQueue } from './queue-context';
import { createPhotoSender, roomOnServer } from './send-photo';
import type { WalkthroughQueue } from './walkthrough-queue';

type Overrides = Partial<Omit<FileQueueOptions, 'send' | 'roomReady'>> & { readonly person?: string };

/** The app's photo queue: uploads through the API and retries whenever a room may just have reached the server. */
export function createPhotoQueue(
  queryClient: QueryClient,
  edits: WalkthroughQueue,
  overrides: Overrides = {},
): FileQueue {
  const { person, ...options } = overrides;
  const queue = new FileQueue({
    storage: memoryFileStorage(),
    send: createPhotoSender(queryClient, person),
    roomReady: roomOnServer(queryClient, edits),
    ...options,
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

/** The signed-in person's waiting photos, in their own store; another person's stop and stay stored. */
export const sharedPhotoQueue = perPerson(
  (person, { queryClient, edits }: { queryClient: QueryClient; edits: WalkthroughQueue }) =>
    createPhotoQueue(queryClient, edits, {
      storage: person ? idbFileStorage(personStores(person).photos) : memoryFileStorage(),
      person: person?.userId,
    }),
);

const PhotoQueueContext = createContext<FileQueue | null>(null);

/** Tests hand in their own queue (memory storage). */
export function PhotoQueueProvider({ queue, children }: { queue: FileQueue; children: ReactNode }) {
  return <PhotoQueueContext.Provider value={queue}>{children}</PhotoQueueContext.Provider>;
}

const byEdits = new WeakMap<WalkthroughQueue, { queryClient: QueryClient; edits: WalkthroughQueue }>();

export function usePhotoQueue(): FileQueue {
  const injected = useContext(PhotoQueueContext);
  const queryClient = useQueryClient();
  const edits = useWalkthroughQueue();
  let on = byEdits.get(edits);
  if (on?.queryClient !== queryClient) {
    on = { queryClient, edits };
    byEdits.set(edits, on);
  }
  return useOfflineQueue<FileQueueState, FileQueue>(injected ?? sharedPhotoQueue(on)).runner;
}

export function usePhotoQueueState(): FileQueueState {
  return useOfflineQueue<FileQueueState, FileQueue>(usePhotoQueue()).state;
}
