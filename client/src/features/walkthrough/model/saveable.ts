import { roomInputSchema } from '@calc';
import { sameValue } from '../../../lib/offline/conflict';
import { checkRoom } from './validate-room';
import type { Draft } from './draft';

/** Fields calc checks together: one refused puts back all of them ("enter the length and width, or the area"). */
const TOGETHER: Record<string, string[]> = {
  lengthFt: ['lengthFt', 'widthFt', 'areaFt2'],
  widthFt: ['lengthFt', 'widthFt', 'areaFt2'],
  areaFt2: ['lengthFt', 'widthFt', 'areaFt2'],
};

/**
 * The part of a room draft that can be saved while some field shows an error: every top-level
 * field that has an error (a wall's length puts back the whole wall list) keeps its saved value
 * (`saved`), everything else is the draft. Null when no such room passes calc's schema (an error
 * about the room as a whole). A value refused on screen is never sent, not even a prefix of it.
 */
export function saveablePart(draft: Draft, saved: Draft): Draft | null {
  let candidate: Draft = { ...draft };
  for (let round = 0; round < 20; round++) {
    const check = checkRoom(candidate);
    if (check.ok) return candidate;
    const keys = new Set([...check.errors.keys()].flatMap((k) => TOGETHER[k.split('.')[0] ?? ''] ?? [k.split('.')[0]]));
    if (keys.has('')) return null;
    const revert = (k: string) => {
      if (sameValue(candidate[k], saved[k])) return false;
      const next: Draft = { ...candidate };
      if (saved[k] === undefined) delete next[k];
      else next[k] = saved[k];
      candidate = next;
      return true;
    };
    let changed = false;
    for (const k of keys) if (k !== undefined && revert(k)) changed = true;
    // Saved walls measured against a new ceiling height: the height waits with them.
    if (!changed && keys.has('exposedWalls')) changed = revert('ceilingHeightFt');
    if (!changed) return null;
  }
  return null;
}

/** Two room inputs that say the same as calc reads them (defaults filled, key order and id ignored). */
export function sameRoomInput(a: Draft, b: Draft): boolean {
  const read = (x: Draft) => {
    const parsed = roomInputSchema.safeParse({ ...x, id: undefined });
    return parsed.success ? parsed.data : { ...x, id: undefined };
  };
  return sameValue(read(a), read(b));
}
