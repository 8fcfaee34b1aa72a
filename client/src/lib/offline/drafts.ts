import { getCurrentPerson, personKey } from './person';

/**
 * What the person typed in a room that calc's schema does not accept yet (say a window
 * larger than its wall, half-way through fixing it). Valid drafts go to the offline queue;
 * these are kept on the device (localStorage: synchronous, so the editor can restore them
 * before its first paint) until the room becomes valid or the server's room moves on.
 */
const PREFIX = 'gaugeline:unsaved-room:v2:';

/** Per person, like everything the device keeps (lib/offline/person.ts). */
function keyOf(roomId: string): string {
  const person = getCurrentPerson();
  return `${PREFIX}${person ? personKey(person) : 'nobody'}:${roomId}`;
}

export interface UnsavedDraft {
  /** The room version the draft was typed against; null for a room not yet on the server. */
  readonly baseVersion: number | null;
  readonly input: Record<string, unknown>;
  /** The part of the draft that was sent (its refused fields at their saved values), if any was. */
  readonly sent?: Record<string, unknown> | undefined;
}

function storage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function isDraft(v: unknown): v is UnsavedDraft {
  if (typeof v !== 'object' || v === null || !('input' in v) || !('baseVersion' in v)) return false;
  const { input, baseVersion } = v;
  return (
    typeof input === 'object' &&
    input !== null &&
    !Array.isArray(input) &&
    (baseVersion === null || typeof baseVersion === 'number')
  );
}

export function keepUnsavedDraft(roomId: string, draft: UnsavedDraft): void {
  try {
    storage()?.setItem(keyOf(roomId), JSON.stringify(draft));
  } catch {
    // Storage full or refused: the draft stays on screen; nothing else to do.
  }
}

export function clearUnsavedDraft(roomId: string): void {
  storage()?.removeItem(keyOf(roomId));
}

/**
 * The draft typed against this very version, or whose sent part is what the record now holds
 * (`holdsSent`: the server moved on only by this draft's own saves); any other draft is discarded.
 */
export function takeUnsavedDraft(
  roomId: string,
  version: number | null,
  holdsSent?: (sent: Record<string, unknown>) => boolean,
): UnsavedDraft | null {
  const raw = storage()?.getItem(keyOf(roomId));
  if (!raw) return null;
  let parsed: unknown = null;
  try {
    parsed = JSON.parse(raw);
  } catch {
    parsed = null;
  }
  const sent = isDraft(parsed) && 'sent' in parsed && isObject(parsed.sent) ? parsed.sent : undefined;
  const current = isDraft(parsed) && (parsed.baseVersion === version || (sent && holdsSent?.(sent)));
  if (!isDraft(parsed) || !current) {
    clearUnsavedDraft(roomId);
    return null;
  }
  return parsed;
}
