import { enteredOf, notesOf, type CustomerRecord, type JobRecord } from '@contract';
import { sameValue } from '../../../lib/offline/conflict';
import { sameRoomInput } from '../model/saveable';
import type { CustomerChanges, JobChanges } from '../../../entities/job/requests';
import type { RoomInputValue } from './edits';

/**
 * A 409 whose edit the record already holds is no conflict: the same change reached the server
 * before (an answer lost when the signal dropped, then replayed), or someone typed the very same.
 * These say whether every field the edit writes already reads the same on the record.
 */
export const roomHolds = (room: { readonly input: RoomInputValue }, input: RoomInputValue) =>
  sameRoomInput(room.input, input);

function jobValue(job: JobRecord, key: keyof JobChanges): unknown {
  switch (key) {
    case 'designConditions':
      return enteredOf(job.designConditions, job.designSources);
    case 'designSourceNotes':
      return notesOf(job.designSources);
    case 'tightness':
      return job.tightness;
    case 'house':
      return job.house ?? {};
    case 'notes':
      return job.notes;
    case 'salespersonId':
      return job.salesperson?.id ?? '';
    case 'assignedInstallerId':
      return job.assignedInstaller?.id ?? null;
    case 'status':
      return job.status;
    case 'lostReason':
      return job.lostReason;
    default:
      return job.site[key] ?? '';
  }
}

export function jobHolds(job: JobRecord, changes: JobChanges): boolean {
  return (Object.keys(changes) as (keyof JobChanges)[]).every((k) =>
    changes[k] === undefined ? true : sameValue(jobValue(job, k), changes[k]),
  );
}

export function customerHolds(customer: CustomerRecord, changes: CustomerChanges): boolean {
  const blank = (v: unknown) => (v === '' || v === undefined ? null : v);
  return (Object.keys(changes) as (keyof CustomerChanges)[]).every(
    (k) => changes[k] === undefined || blank(changes[k]) === blank(customer[k]),
  );
}
