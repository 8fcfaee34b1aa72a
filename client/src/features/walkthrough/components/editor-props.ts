import type { PathPart } from '../model/draft';

/** What every part of the room editor gets: the draft, a setter by path and errors by path. */
export interface EditorProps {
  readonly draft: Record<string, unknown>;
  readonly set: (path: readonly PathPart[], value: unknown) => void;
  readonly err: (path: readonly PathPart[]) => string | undefined;
}
