import type { QueueItem } from '../../../lib/offline/queue';
import {
  ADDRESS_FIELDS,
  type CustomerRecord,
  type JobRecord,
  type RoomRecord,
  DESIGN_FIELDS,
  resolveDesign,
  TIGHTNESS,
  type EnteredDesign,
} from '@contract';
import type { JobChanges } from '../../../entities/job/requests';
import type { RoomInputValue, WalkthroughEdit } from './edits';

/** A room as the screen shows it: the server's record with any waiting edit laid over it. */
export interface RoomView {
  readonly id: string;
  readonly position: number;
  readonly input: RoomInputValue;
  /** The version last seen from the server; null until a queued create reaches it. */
  readonly version: number | null;
  readonly photos: RoomRecord['photos'];
  readonly waiting: boolean;
}

/**
 * What the person sees after a reload: the server's rooms, then every queued edit of this
 * job applied in queue order (creates added, updates replacing the input, deletes hiding).
 */
export function overlayRooms(
  jobId: string,
  server: readonly RoomRecord[],
  queue: readonly QueueItem<WalkthroughEdit>[],
): RoomView[] {
  const rooms = new Map<string, RoomView>(
    server.map((r) => [
      r.id,
      { id: r.id, position: r.position, input: r.input, version: r.version, photos: r.photos, waiting: false },
    ]),
  );
  for (const { payload: e } of queue) {
    if (e.jobId !== jobId) continue;
    if (e.kind === 'room-create') {
      const known = rooms.get(e.roomId);
      rooms.set(e.roomId, {
        id: e.roomId,
        position: e.position,
        input: e.input,
        version: known?.version ?? null,
        photos: known?.photos ?? [],
        waiting: true,
      });
    } else if (e.kind === 'room-update') {
      const known = rooms.get(e.roomId);
      if (known) rooms.set(e.roomId, { ...known, input: e.input, waiting: true });
    } else if (e.kind === 'room-delete') {
      rooms.delete(e.roomId);
    }
  }
  return [...rooms.values()].sort((a, b) => a.position - b.position);
}

/** The job with its queued changes: entered design values laid over what the server resolved. */
export function overlayJob(
  job: JobRecord,
  queue: readonly QueueItem<WalkthroughEdit>[],
  companyDefaults: Record<string, unknown> | null = null,
): { job: JobRecord; waiting: boolean } {
  let out = job;
  let waiting = false;
  for (const { payload: e } of queue) {
    if (e.kind !== 'job-update' || e.jobId !== job.id) continue;
    waiting = true;
    const typed = e.changes.designConditions;
    const entered: EnteredDesign = {};
    for (const f of DESIGN_FIELDS) {
      const v = typed?.[f];
      if (typeof v === 'number') entered[f] = v;
    }
    if (typeof typed?.source === 'string') entered.source = typed.source;
    if (typeof typed?.clearSkySource === 'string') entered.clearSkySource = typed.clearSkySource;
    const resolved = typed ? resolveDesign(entered, companyDefaults) : null;
    const designConditions = resolved?.conditions ?? out.designConditions;
    const designSources = { ...out.designSources };
    for (const [field, note] of Object.entries(e.changes.designSourceNotes ?? {})) {
      designSources[field] = { source: designSources[field]?.source ?? 'entered', note };
    }
    if (typed) {
      for (const [field, origin] of Object.entries(resolved?.origin ?? {})) {
        designSources[field] = { source: origin, note: designSources[field]?.note ?? '' };
      }
    }
    out = {
      ...out,
      designConditions,
      designSources,
      tightness: isTightness(e.changes.tightness) ? e.changes.tightness : out.tightness,
      house: e.changes.house ?? out.house,
    };
    out = withDetails(out, e.changes);
  }
  return { job: out, waiting };
}

/** Job details waiting in the queue, laid over the job (a person's name stays until the server answers). */
function withDetails(job: JobRecord, c: JobChanges): JobRecord {
  const site = { ...job.site };
  for (const k of ADDRESS_FIELDS) {
    const v = c[k];
    if (v !== undefined) site[k] = v;
  }
  const person = (id: string, held: { id: string; name: string } | null) => ({
    id,
    name: held?.id === id ? held.name : '',
  });
  return {
    ...job,
    site,
    notes: c.notes ?? job.notes,
    salesperson: c.salespersonId !== undefined ? person(c.salespersonId, job.salesperson) : job.salesperson,
    assignedInstaller:
      c.assignedInstallerId === undefined
        ? job.assignedInstaller
        : c.assignedInstallerId === null
          ? null
          : person(c.assignedInstallerId, job.assignedInstaller),
  };
}

/** The customer with their waiting changes (job details typed with no signal, or not yet sent). */
export function overlayCustomer(
  customer: CustomerRecord,
  queue: readonly QueueItem<WalkthroughEdit>[],
): CustomerRecord {
  let out = customer;
  for (const { payload: e } of queue) {
    if (e.kind !== 'customer-update' || e.customerId !== customer.id) continue;
    out = { ...out, ...e.changes };
  }
  return out;
}

function isTightness(v: string | undefined): v is JobRecord['tightness'] {
  return TIGHTNESS.some((t) => t === v);
}
