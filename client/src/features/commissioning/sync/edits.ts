import type { CommissioningPatch, RefrigerantEntryInput } from '@contract';
import type { Coalesce, QueueItem } from '../../../lib/offline/queue';

/** One saved step of the record (the parts it changes), or one weighing of refrigerant. */
export type CommissioningEdit =
  | { readonly kind: 'record-patch'; readonly jobId: string; readonly patch: CommissioningPatch }
  | { readonly kind: 'refrigerant'; readonly jobId: string; readonly entry: RefrigerantEntryInput };

export type CommissioningItem = QueueItem<CommissioningEdit>;

export const recordTarget = (jobId: string) => `commissioning:${jobId}`;
export const entryTarget = (entryId: string) => `refrigerant:${entryId}`;

/** A step saved again while the last is still waiting: one write with both (the later part wins). */
export const coalesceCommissioning: Coalesce<CommissioningEdit> = (waiting, next) => {
  const w = waiting.payload;
  const n = next.payload;
  if (w.kind === 'record-patch' && n.kind === 'record-patch')
    return { ...waiting, payload: { ...w, patch: { ...w.patch, ...n.patch } } };
  return null;
};

/** Reading the queue back from IndexedDB: an edit this version of the app knows how to send. */
export function isCommissioningEdit(v: unknown): v is CommissioningEdit {
  if (typeof v !== 'object' || v === null) return false;
  const r: Record<string, unknown> = { ...v };
  if (typeof r.jobId !== 'string') return false;
  if (r.kind === 'record-patch') return typeof r.patch === 'object' && r.patch !== null;
  if (r.kind === 'refrigerant')
    return typeof r.entry === 'object' && r.entry !== null && typeof Reflect.get(r.entry, 'id') === 'string';
  return false;
}

/** The record's parts as this phone has them: the server's, with every step still waiting laid over it. */
export function pendingPatch(items: readonly CommissioningItem[], jobId: string): CommissioningPatch {
  let out: CommissioningPatch = {};
  for (const i of items)
    if (i.payload.kind === 'record-patch' && i.payload.jobId === jobId) out = { ...out, ...i.payload.patch };
  return out;
}

export const pendingEntries = (items: readonly CommissioningItem[], jobId: string): RefrigerantEntryInput[] =>
  items.flatMap((i) => (i.payload.kind === 'refrigerant' && i.payload.jobId === jobId ? [i.payload.entry] : []));
