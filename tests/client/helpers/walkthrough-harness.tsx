import type { RoomInput } from '@calc';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { fireEvent, render, waitFor } from '@testing-library/react';
import { Suspense, type ReactNode } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { memoryQueueStorage, type QueueItem, type SendResult } from '../../../client/src/lib/offline/queue';
import { OfflineQueue } from '../../../client/src/lib/offline/queue-runner';
import { createQueryClient } from '../../../client/src/lib/query-client';
import { coalesceEdits, type WalkthroughEdit } from '../../../client/src/features/walkthrough/sync/edits';
import { WalkthroughQueueProvider } from '../../../client/src/features/walkthrough/sync/queue-context';
import {
  createPhotoQueue,
  PhotoQueueProvider,
} from '../../../client/src/features/walkthrough/sync/photo-queue-context';
import { memoryFileStorage, type FileStorage } from '../../../client/src/lib/offline/file-storage';
import { createEditSender } from '../../../client/src/features/walkthrough/sync/send-edit';
import type { RoomView } from '../../../client/src/features/walkthrough/sync/overlay';
import { loadEngine } from '../../../client/src/features/loads/components/live-engine';

export const JOB_ID = '11111111-1111-4111-8111-111111111111';
export const ROOM_ID = '22222222-2222-4222-8222-222222222222';

export const designConditions = {
  outdoorCoolingDryBulbF: 95,
  outdoorCoolingWetBulbF: 75,
  outdoorHeatingDryBulbF: 20,
  indoorCoolingF: 75,
  indoorHeatingF: 70,
  indoorCoolingRhPercent: 50,
  dailyRangeF: 20,
  elevationFt: 0,
};

export const bedroomInput = {
  id: ROOM_ID,
  name: 'Bedroom 2',
  floorLevel: 1,
  lengthFt: 12,
  widthFt: 10,
  ceilingHeightFt: 8,
  exposedWalls: [
    {
      direction: 'W',
      lengthFt: 10,
      construction: 'wood-2x4-r13',
      windows: [{ widthIn: 36, heightIn: 48, count: 1, glazing: 'double-clear', interiorShading: 'none' }],
      doors: [],
    },
  ],
  above: { kind: 'attic', insulation: 'r30' },
  below: { kind: 'slab', edgeInsulated: false },
  occupants: 2,
  appliances: [],
  notes: '',
} satisfies RoomInput;

export function roomView(input: Record<string, unknown> = bedroomInput, version: number | null = 3): RoomView {
  return { id: ROOM_ID, position: 0, input, version, photos: [], waiting: false };
}

export function roomRecord(input: Record<string, unknown>, version: number) {
  return {
    id: ROOM_ID,
    jobId: JOB_ID,
    position: 0,
    input,
    version,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
    photos: [],
  };
}

type Send = (item: QueueItem<WalkthroughEdit>) => Promise<SendResult>;

/** A queue on memory storage; 'real' uses the app's sender (the test mocks fetch), default accepts everything. */
export function testQueue(
  queryClient: QueryClient,
  send: Send | 'real' = async () => ({ kind: 'ok', version: 4 }),
  online: () => boolean = () => true,
  stored: readonly QueueItem<WalkthroughEdit>[] = [],
) {
  const storage = memoryQueueStorage<WalkthroughEdit>(stored);
  const sender = send === 'real' ? createEditSender(queryClient) : send;
  const queue = new OfflineQueue<WalkthroughEdit>({
    storage,
    send: sender,
    coalesce: coalesceEdits,
    isOnline: online,
    retryMs: 0,
  });
  return { queue, storage };
}

interface RenderOptions {
  send?: Send | 'real';
  online?: () => boolean;
  queryClient?: QueryClient;
  stored?: readonly QueueItem<WalkthroughEdit>[];
  /** Waiting photos (memory): pass the same storage twice to stand for a reload. */
  photoStorage?: FileStorage;
  /** Where the memory router starts (for a route component that reads its params). */
  path?: string;
}

export async function renderWalkthrough(ui: ReactNode, options: RenderOptions = {}) {
  const queryClient = options.queryClient ?? createQueryClient();
  const { queue, storage } = testQueue(queryClient, options.send, options.online, options.stored);
  const photoStorage = options.photoStorage ?? memoryFileStorage();
  // The photo queue uploads for real (tests mock fetch) and reads the same connection as the edit queue.
  const photoQueue = createPhotoQueue(queryClient, queue, {
    storage: photoStorage,
    isOnline: options.online ?? (() => true),
    retryMs: 0,
  });
  await queue.start();
  await photoQueue.start();
  // The app fetches the live loads' engine after the page's first idle moment; here it is held from the start.
  await loadEngine();
  const view = render(
    <QueryClientProvider client={queryClient}>
      <WalkthroughQueueProvider queue={queue}>
        <PhotoQueueProvider queue={photoQueue}>
          <MemoryRouter initialEntries={[options.path ?? '/']}>
            <Suspense fallback="loading">{ui}</Suspense>
          </MemoryRouter>
        </PhotoQueueProvider>
      </WalkthroughQueueProvider>
    </QueryClientProvider>,
  );
  return { ...view, queue, storage, queryClient, photoQueue, photoStorage };
}

export function jobRecord(overrides: Record<string, unknown> = {}) {
  return {
    id: JOB_ID,
    status: 'walkthrough' as const,
    customer: { id: 'c1', name: 'Rowan Example' },
    site: { street: '12 Sample Lane', unit: '', city: 'Testville', region: 'TS', postalCode: '00000' },
    salesperson: { id: 'u1', name: 'Sam Seller' },
    assignedInstaller: null,
    notes: '',
    designConditions: designConditions,
    designSources: {},
    tightness: 'average' as const,
    version: 2,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
    lastActivityAt: '2026-01-01T00:00:00.000Z',
    hasProposal: false,
    lostReason: null,
    ...overrides,
  };
}

/**
 * Taps the line of every folded part of the room form, then of the parts that shows inside them (a wall's
 * windows), as a person opening them would: a folded part makes its fields only when first opened (issue 11).
 * Resolves once each opened part shows more than its line. `within`: where to look (default: the page).
 */
export async function openFolds(within: ParentNode = document): Promise<void> {
  for (let round = 0; round < 4; round += 1) {
    const closed = [...within.querySelectorAll('details:not([open])')].filter(
      (d): d is HTMLDetailsElement => d instanceof HTMLDetailsElement && d.querySelector(':scope > summary') !== null,
    );
    if (closed.length === 0) return;
    for (const d of closed) fireEvent.click(d.querySelector(':scope > summary') as HTMLElement);
    await waitFor(() => {
      for (const d of closed) if (d.children.length < 2) throw new Error('a folded part has not opened yet');
    });
  }
}
