import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createContext, useContext } from 'react';
import type { CommissioningRecord } from '@contract';
import { personStores } from '../../../lib/offline/person';
import {
  idbQueueStorage,
  memoryQueueStorage,
  type QueueState,
  type QueueStorage,
  type SendResult,
} from '../../../lib/offline/queue';
import { OfflineQueue } from '../../../lib/offline/queue-runner';
import { sendFailure } from '../../../lib/offline/send-failure';
import { perPerson, useOfflineQueue } from '../../../lib/offline/use-offline-queue';
import { commissioningKeys, patchRecord, postRefrigerant } from '../api/record';
import { coalesceCommissioning, isCommissioningEdit, type CommissioningEdit, type CommissioningItem } from './edits';

export type CommissioningQueue = OfflineQueue<CommissioningEdit>;

/** Its own key in the person's queue store, beside the walk-through's. */
const STORAGE_KEY = 'gaugeline:commissioning-queue:v1';

/** Sends one queued step and puts the server's record into the cache (the persister keeps it on the phone). */
export function createCommissioningSender(queryClient: QueryClient, person?: string) {
  return async (item: CommissioningItem): Promise<SendResult> => {
    const edit = item.payload;
    try {
      const record =
        edit.kind === 'record-patch'
          ? await patchRecord(edit.jobId, item.baseVersion, edit.patch, person)
          : await postRefrigerant(edit.jobId, edit.entry, person);
      queryClient.setQueryData<CommissioningRecord>(commissioningKeys.record(edit.jobId), record);
      return { kind: 'ok', version: edit.kind === 'record-patch' ? record.version : null };
    } catch (e) {
      return sendFailure(e);
    }
  };
}

export function createCommissioningQueue(
  queryClient: QueryClient,
  storage: QueueStorage<CommissioningEdit> = memoryQueueStorage<CommissioningEdit>(),
  retryMs = 15_000,
  person?: string,
): CommissioningQueue {
  return new OfflineQueue<CommissioningEdit>({
    storage,
    send: createCommissioningSender(queryClient, person),
    coalesce: coalesceCommissioning,
    retryMs,
  });
}

/** The signed-in person's commissioning queue (one per tab and person; lib/offline/use-offline-queue.ts). */
export const sharedCommissioningQueue = perPerson((person, queryClient: QueryClient) =>
  createCommissioningQueue(
    queryClient,
    person
      ? idbQueueStorage(isCommissioningEdit, personStores(person).queue, STORAGE_KEY)
      : memoryQueueStorage<CommissioningEdit>(),
    15_000,
    person?.userId,
  ),
);

/** Tests hand in their own queue. */
export const CommissioningQueueContext = createContext<CommissioningQueue | null>(null);

export function useCommissioningQueue(): { queue: CommissioningQueue; state: QueueState<CommissioningEdit> } {
  const injected = useContext(CommissioningQueueContext);
  const queryClient = useQueryClient();
  const { runner, state } = useOfflineQueue<QueueState<CommissioningEdit>, CommissioningQueue>(
    injected ?? sharedCommissioningQueue(queryClient),
  );
  return { queue: runner, state };
}
