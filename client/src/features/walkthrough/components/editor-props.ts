import type { PathPart } from '../model/draft';

/**
 * Replaces the whole room: with `next`, or, given a function, with what it makes of the room as it stands
 * when the change lands (what a part rendered earlier must use: its own `draft` may be older).
 */
export type Replace = (next: unknown) => void;

/** What every part of the room editor gets: the draft, a setter by path and errors by path. */
export interface EditorProps {
  readonly draft: Record<string, unknown>;
  /** Stable for the editor's life: sets one value on the room as it stands (never on an older render's draft). */
  readonly set: (path: readonly PathPart[], value: unknown) => void;
  /** Changes identity only when the room's errors change. */
  readonly err: (path: readonly PathPart[]) => string | undefined;
}

/**
 * The props check of a memoised part of the room editor (issue 11: a keystroke re-rendered the whole form,
 * 25–35 ms per key on a 4× slowed phone): every prop but the draft by identity, and of the draft only the
 * parts the component shows (`parts`), which keep their identity while nothing in them changes (`setIn`
 * copies only the path it writes). So a key re-renders the field's own part and skips the rest.
 *
 * A part skipped this way still holds an older draft, so its buttons change the room through a function
 * of the latest one (`replace((latest) => …)`) and its fields through `set`, never from `draft` itself.
 */
export function sameDraftParts<P extends EditorProps>(parts: (props: P) => readonly unknown[]) {
  return (a: Readonly<P>, b: Readonly<P>): boolean => {
    const keys = Object.keys(a) as (keyof P)[];
    if (keys.length !== Object.keys(b).length) return false;
    if (keys.some((k) => k !== 'draft' && a[k] !== b[k])) return false;
    const [x, y] = [parts(a), parts(b)];
    return x.length === y.length && x.every((v, i) => v === y[i]);
  };
}
