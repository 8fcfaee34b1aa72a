import type { LastChangeRecord } from '@contract';
import type { Actor } from './route';

/** The columns a record keeps about its latest change (migration …060000_change_stamps). */
export interface ChangeStamp {
  changedById?: string | null;
  changedByName?: string | null;
  changedOnDevice?: string | null;
}

/** The stamp a write by this person on this device leaves on the record it changes. */
export function stampOf(actor: Actor): Required<ChangeStamp> {
  return { changedById: actor.userId, changedByName: actor.name, changedOnDevice: actor.device ?? null };
}

/** The record's `lastChange`: null when nothing is known (changed before stamps were kept, or by the seed). */
export function presentLastChange(s: ChangeStamp): LastChangeRecord | null {
  if (!s.changedByName && !s.changedOnDevice) return null;
  return { byName: s.changedByName ?? null, device: s.changedOnDevice ?? null };
}
