import type { Tightness } from '@calc';
import { useMemo, useRef } from 'react';
import { engineWaitMessage, useLoadEngine } from './live-engine';

interface Props {
  rooms: readonly { readonly id: string; readonly input: Record<string, unknown> }[];
  designConditions: Record<string, unknown> | null;
  tightness: Tightness;
  house?: Record<string, unknown> | undefined;
}

type Rooms = Props['rooms'];

/** The same rooms as last time (each id with the same input object): the page rendered again for something else. */
const sameRooms = (a: Rooms, b: Rooms) =>
  a.length === b.length && a.every((r, i) => r.id === b[i]?.id && r.input === b[i]?.input);

/**
 * The rooms list, kept as the same array while its rooms stay the same: the walk-through lays the queue
 * over the server's rooms on every render (a new array each time), and the totals need not be worked
 * out again because the save status changed.
 */
function useSteadyRooms(rooms: Rooms): Rooms {
  const held = useRef(rooms);
  if (held.current !== rooms && !sameRooms(held.current, rooms)) held.current = rooms;
  return held.current;
}

/** The whole home, recomputed in the browser from the rooms as they stand (saved or waiting). */
export function LiveHomeTotals({ rooms, designConditions, tightness, house }: Props) {
  const engine = useLoadEngine({ rooms, house, designConditions, tightness });
  const steady = useSteadyRooms(rooms);
  const parts = engine.status === 'ready' ? engine.engine : null;
  const result = useMemo(
    () => parts?.computeLiveHomeLoad(steady, designConditions, tightness, house ?? {}) ?? null,
    [parts, steady, designConditions, tightness, house],
  );
  if (!parts || !result)
    return <p className="rounded-md border border-line bg-white p-4 text-muted">{engineWaitMessage(engine)}</p>;
  if (!result.ok) return <p className="rounded-md border border-line bg-white p-4 text-muted">{result.message}</p>;
  return <parts.HomeTotals load={result.value.load} skipped={result.value.skipped} />;
}
