import type { Tightness } from '@calc';
import { engineWaitMessage, useLoadEngine } from './live-engine';

interface Props {
  rooms: readonly { readonly id: string; readonly input: Record<string, unknown> }[];
  designConditions: Record<string, unknown> | null;
  tightness: Tightness;
  house?: Record<string, unknown> | undefined;
}

/** The whole home, recomputed in the browser from the rooms as they stand (saved or waiting). */
export function LiveHomeTotals({ rooms, designConditions, tightness, house }: Props) {
  const engine = useLoadEngine();
  if (engine.status !== 'ready')
    return <p className="rounded-md border border-line bg-white p-4 text-muted">{engineWaitMessage(engine)}</p>;
  const result = engine.engine.computeHomeLoad(rooms, designConditions, tightness, house ?? {});
  if (!result.ok) return <p className="rounded-md border border-line bg-white p-4 text-muted">{result.message}</p>;
  return <engine.engine.HomeTotals load={result.value.load} skipped={result.value.skipped} />;
}
