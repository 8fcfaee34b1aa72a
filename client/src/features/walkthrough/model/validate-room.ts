import { roomInputSchema, roomPlausibilityWarnings, type PlausibilityWarning, type Room } from '@calc';
import type { RoomInputValue } from '../sync/edits';

export type FieldErrors = ReadonlyMap<string, string>;

export type RoomCheck =
  | {
      readonly ok: true;
      readonly room: Room;
      readonly warnings: readonly PlausibilityWarning[];
      readonly errors: FieldErrors;
    }
  | { readonly ok: false; readonly errors: FieldErrors };

/** Dotted path of a field, the same string the fields use as their name ("exposedWalls.0.lengthFt"). */
export const pathKey = (path: readonly PropertyKey[]) => path.map(String).join('.');

/** calc's room schema (the one the server validates with) plus its plain-word warnings. */
export function checkRoom(input: RoomInputValue): RoomCheck {
  const parsed = roomInputSchema.safeParse(input);
  if (!parsed.success) {
    const errors = new Map<string, string>();
    for (const issue of parsed.error.issues) {
      const key = pathKey(issue.path);
      if (!errors.has(key)) errors.set(key, issue.message);
    }
    return { ok: false, errors };
  }
  return { ok: true, room: parsed.data, warnings: roomPlausibilityWarnings(parsed.data), errors: new Map() };
}
