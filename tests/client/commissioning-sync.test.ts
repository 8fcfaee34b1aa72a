import { afterEach, describe, expect, it } from 'vitest';
import type { QueueItem, QueueStorage } from '../../client/src/lib/offline/queue';
import { OfflineQueue } from '../../client/src/lib/offline/queue-runner';
import {
  coalesceCommissioning,
  entryTarget,
  isCommissioningEdit,
  pendingEntries,
  pendingPatch,
  recordTarget,
  type CommissioningEdit,
} from '../../client/src/features/commissioning/sync/edits';
import { checkStep } from '../../client/src/features/commissioning/model/check';

/** Storage that, like IndexedDB, keeps a structured copy: a "reload" sees only what was written. */
function durableStorage(): QueueStorage<CommissioningEdit> {
  let stored = '[]';
  return {
    load: async () => JSON.parse(stored),
    save: async (items) => {
      stored = JSON.stringify(items);
    },
  };
}

const queues: OfflineQueue<CommissioningEdit>[] = [];
afterEach(() => {
  for (const q of queues.splice(0)) q.stop();
});
const offlineQueue = async (storage: QueueStorage<CommissioningEdit>) => {
  const q = new OfflineQueue<CommissioningEdit>({
    storage,
    send: async () => ({ kind: 'network' }),
    coalesce: coalesceCommissioning,
    isOnline: () => false,
    retryMs: 0,
  });
  queues.push(q);
  await q.start();
  return q;
};

const TEST = {
  testGas: 'nitrogen',
  testPsig: 300,
  gaugeResolutionPsi: 1,
  startPsig: 300,
  startF: 70,
  endPsig: 294,
  endF: 60,
  holdMinutes: 60,
};

describe('the commissioning record on the offline kit', () => {
  it('steps entered with no signal survive a reload, folded into one write, with the weighings in order', async () => {
    const storage = durableStorage();
    const q = await offlineQueue(storage);
    await q.enqueue({
      target: recordTarget('j1'),
      baseVersion: 3,
      payload: { kind: 'record-patch', jobId: 'j1', patch: { pressureTest: TEST } },
    });
    await q.enqueue({
      target: recordTarget('j1'),
      baseVersion: 3,
      payload: {
        kind: 'record-patch',
        jobId: 'j1',
        patch: { evacuation: { reachedMicrons: 410, afterHoldMicrons: 780, holdMinutes: 10, holdReadings: [] } },
      },
    });
    const entry = {
      id: '6f0c1f5e-3d0b-4a8e-9a55-0d2b7c1e4f10',
      systemKey: 'sys-1',
      refrigerant: 'R-32',
      addedOz: 4,
      recoveredOz: 0,
      lot: null,
      additives: null,
    };
    await q.enqueue({
      target: entryTarget(entry.id),
      baseVersion: null,
      payload: { kind: 'refrigerant', jobId: 'j1', entry },
    });
    q.stop();

    // A reload: a new queue over what was stored.
    const again = await offlineQueue(storage);
    const items = again.getSnapshot().items as readonly QueueItem<CommissioningEdit>[];
    expect(items).toHaveLength(2);
    expect(items.every((i) => isCommissioningEdit(i.payload))).toBe(true);
    expect(pendingPatch(items, 'j1')).toEqual({
      pressureTest: TEST,
      evacuation: { reachedMicrons: 410, afterHoldMicrons: 780, holdMinutes: 10, holdReadings: [] },
    });
    expect(pendingEntries(items, 'j1')).toEqual([entry]);
    expect(pendingPatch(items, 'another job')).toEqual({});
  });

  it('refuses oxygen and a test pressure above the equipment’s beside the field, before anything is queued', () => {
    const oxygen = checkStep('pressureTest', { ...TEST, testGas: 'oxygen' }, 550);
    expect(oxygen.testGas).toMatch(/^Never oxygen/);
    const over = checkStep('pressureTest', { ...TEST, testPsig: 600 }, 550);
    expect(over.testPsig).toMatch(/550 psig from the catalog/);
    expect(checkStep('pressureTest', TEST, 550)).toEqual({});
    const negative = checkStep(
      'evacuation',
      { reachedMicrons: -1, afterHoldMicrons: 600, holdMinutes: 10, holdReadings: [] },
      null,
    );
    expect(negative.reachedMicrons).toMatch(/cannot be below zero/);
  });
});
