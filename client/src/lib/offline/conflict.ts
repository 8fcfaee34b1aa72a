/**
 * After a 409: the fields that differ between what this person saved and what the server now
 * has, and the record made of each field's chosen side. Any record type can use it: the caller
 * names the fields (labels) and says how a value reads (ConflictChoices' `describe`).
 */
/** A field that differs between what this person saved and what the server now has. */
export interface FieldDiff {
  readonly key: string;
  readonly label: string;
  readonly mine: unknown;
  readonly theirs: unknown;
}

export type Choice = 'mine' | 'theirs';

/** JSON with object keys sorted and undefined keys left out: two records equal field by field read the same. */
function canonical(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (typeof v === 'object' && v !== null)
    return Object.fromEntries(
      Object.entries(v)
        .filter(([, x]) => x !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
        .map(([k, x]) => [k, canonical(x)]),
    );
  return v ?? null;
}

/** Equal as data: key order and keys holding undefined do not count. */
export const sameValue = (a: unknown, b: unknown) => JSON.stringify(canonical(a)) === JSON.stringify(canonical(b));
const same = sameValue;

/** Top-level fields whose values differ; a whole wall list counts as one field. */
export function diffFields(
  mine: Record<string, unknown>,
  theirs: Record<string, unknown>,
  labels: Record<string, string>,
): FieldDiff[] {
  return Object.keys(labels)
    .filter((k) => !same(mine[k], theirs[k]))
    .map((k) => ({ key: k, label: labels[k] ?? k, mine: mine[k], theirs: theirs[k] }));
}

/** Theirs as the base, with each field the person chose to keep from theirs or from mine. */
export function mergeChoices(
  mine: Record<string, unknown>,
  theirs: Record<string, unknown>,
  choices: Record<string, Choice>,
): Record<string, unknown> {
  const out: Record<string, unknown> = { ...theirs };
  for (const [k, c] of Object.entries(choices)) {
    if (c !== 'mine') continue;
    if (mine[k] === undefined) delete out[k];
    else out[k] = mine[k];
  }
  return out;
}

/** What the server says about a record's latest change (contract `lastChangeRecord`) with its time. */
export interface ChangeFacts {
  readonly updatedAt: string;
  readonly lastChange?: { readonly byName: string | null; readonly device: string | null } | null;
}

/**
 * One sentence on where and when the other change was made: "Changed on another device at 14:32 by
 * Dana Reyes." `thisDevice` is this browser's label (lib/device.ts): an edit from another tab here reads
 * "on this device". Older than today, the date comes first ("on 3 Dec at 14:32"). Nothing known about
 * the person or device (a record changed before they were kept) still gives the time.
 */
export function changedLine(facts: ChangeFacts, thisDevice: string, now: Date = new Date()): string {
  const at = new Date(facts.updatedAt);
  const time = at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
  const sameDay = at.toDateString() === now.toDateString();
  const when = sameDay
    ? `at ${time}`
    : `on ${at.toLocaleDateString([], { day: 'numeric', month: 'short' })} at ${time}`;
  const device = facts.lastChange?.device;
  const where = device ? (device === thisDevice ? ' on this device' : ' on another device') : '';
  const by = facts.lastChange?.byName ? ` by ${facts.lastChange.byName}` : '';
  return `Changed${where} ${when}${by}.`;
}
