import type { CustomerChanges, JobChanges } from '../../../entities/job/requests';
import type { Coalesce, QueueItem } from '../../../lib/offline/queue';

/** A room's input as calc's schema reads it (validated before it is queued). */
export type RoomInputValue = Record<string, unknown>;

/** One autosaved edit. Each carries the whole record as the person left it. */
export type WalkthroughEdit =
  | {
      readonly kind: 'room-create';
      readonly jobId: string;
      readonly roomId: string;
      readonly position: number;
      readonly input: RoomInputValue;
    }
  | { readonly kind: 'room-update'; readonly jobId: string; readonly roomId: string; readonly input: RoomInputValue }
  | { readonly kind: 'room-delete'; readonly jobId: string; readonly roomId: string }
  | { readonly kind: 'job-update'; readonly jobId: string; readonly changes: JobChanges }
  | {
      readonly kind: 'customer-update';
      readonly jobId: string;
      readonly customerId: string;
      readonly changes: CustomerChanges;
    };

export type WalkthroughItem = QueueItem<WalkthroughEdit>;

export const roomTarget = (roomId: string) => `room:${roomId}`;
export const jobTarget = (jobId: string) => `job:${jobId}`;
export const customerTarget = (customerId: string) => `customer:${customerId}`;

/**
 * Folds a new edit into one still waiting for the same record, so a long offline stretch
 * replays as one write per record instead of one per keystroke. Order between records is
 * untouched.
 */
export const coalesceEdits: Coalesce<WalkthroughEdit> = (waiting, next) => {
  const w = waiting.payload;
  const n = next.payload;
  if (w.kind === 'room-create' && n.kind === 'room-update') return { ...waiting, payload: { ...w, input: n.input } };
  if (w.kind === 'room-create' && n.kind === 'room-delete') return 'drop-both';
  if (w.kind === 'room-update' && (n.kind === 'room-update' || n.kind === 'room-delete'))
    return { ...waiting, payload: n };
  if (w.kind === 'job-update' && n.kind === 'job-update')
    return { ...waiting, payload: { ...w, changes: { ...w.changes, ...n.changes } } };
  if (w.kind === 'customer-update' && n.kind === 'customer-update')
    return { ...waiting, payload: { ...w, changes: { ...w.changes, ...n.changes } } };
  return null;
};

const EDIT_KINDS = ['room-create', 'room-update', 'room-delete', 'job-update', 'customer-update'];

/** Reading the queue back from IndexedDB: an edit this version of the app knows how to send. */
export function isWalkthroughEdit(v: unknown): v is WalkthroughEdit {
  if (typeof v !== 'object' || v === null) return false;
  const r: Record<string, unknown> = { ...v };
  if (typeof r.kind !== 'string' || !EDIT_KINDS.includes(r.kind) || typeof r.jobId !== 'string') return false;
  if (r.kind === 'job-update') return typeof r.changes === 'object' && r.changes !== null;
  if (r.kind === 'customer-update')
    return typeof r.customerId === 'string' && typeof r.changes === 'object' && r.changes !== null;
  if (typeof r.roomId !== 'string') return false;
  if (r.kind === 'room-delete') return true;
  return (
    typeof r.input === 'object' && r.input !== null && (r.kind === 'room-update' || typeof r.position === 'number')
  );
}
