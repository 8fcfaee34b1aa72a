import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createContext, useContext, useSyncExternalStore, type ReactNode } from 'react';
import { PhotoQueue, type PhotoQueueOptions, type PhotoQueueState } from './photo-queue';
import { getCurrentPerson, personKey, personStores, useCurrentPerson } from '../../../lib/offline/person';
import { idbPhotoStorage, memoryPhotoStorage } from './photo-storage';
import { useWalkthroughQueue } from './queue-context';
import { createPhotoSender, roomOnServer } from './send-photo';
import type { WalkthroughQueue } from './walkthrough-queue';

type Overrides = Partial<Omit<PhotoQueueOptions, 'send' | 'roomReady'>> & { readonly person?: string };

/** The app's photo queue: uploads through the API and retries whenever a room may just have reached the server. */
export function createPhotoQueue(
  queryClient: QueryClient,
  edits: WalkthroughQueue,
  overrides: Overrides = {},
): PhotoQueue {
  const { person, ...options } = overrides;
  const queue = new PhotoQueue({
    storage: memoryPhotoStorage(),
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

let shared: { readonly key: string; readonly edits: WalkthroughQueue; readonly queue: PhotoQueue } | null = null;

/** The signed-in person's waiting photos, in their own store; another person's stop and stay stored. */
export function sharedPhotoQueue(queryClient: QueryClient, edits: WalkthroughQueue): PhotoQueue {
  const person = getCurrentPerson();
  const key = person ? personKey(person) : '';
  if (shared?.key !== key || shared.edits !== edits) {
    shared?.queue.stop();
    const queue = createPhotoQueue(queryClient, edits, {
      storage: person ? idbPhotoStorage(personStores(person).photos) : memoryPhotoStorage(),
      person: person?.userId,
    });
    shared = { key, edits, queue };
    void queue.start();
  }
  return shared.queue;
}

const PhotoQueueContext = createContext<PhotoQueue | null>(null);

/** Tests hand in their own queue (memory storage). */
export function PhotoQueueProvider({ queue, children }: { queue: PhotoQueue; children: ReactNode }) {
  return <PhotoQueueContext.Provider value={queue}>{children}</PhotoQueueContext.Provider>;
}

export function usePhotoQueue(): PhotoQueue {
  const injected = useContext(PhotoQueueContext);
  useCurrentPerson();
  const queryClient = useQueryClient();
  const edits = useWalkthroughQueue();
  return injected ?? sharedPhotoQueue(queryClient, edits);
}

export function usePhotoQueueState(): PhotoQueueState {
  const queue = usePhotoQueue();
  return useSyncExternalStore(queue.subscribe, queue.getSnapshot, queue.getSnapshot);
}
