import type { PlausibilityWarning, Room } from '@calc';
import { Alert } from '../../../components/ui/alert';
import { computeRoomLoad } from '../model/compute';
import { LazyComponentChart } from './lazy-component-chart';
import { EstimateBadge } from './estimate-note';
import { LoadFigures } from './load-figures';

interface Props {
  /** The room as calc parsed it, or null while the form has errors. */
  room: Room | null;
  warnings: readonly PlausibilityWarning[];
  designConditions: Record<string, unknown> | null;
  tightness: string;
}

/** This room's loads, recomputed in the browser on every change. */
export function RoomLoadPanel({ room, warnings, designConditions, tightness }: Props) {
  const result = room ? computeRoomLoad(room, designConditions, tightness) : null;
  return (
    <section aria-label="Room loads" className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4">
      <div className="flex items-center gap-3">
        <h3 className="text-lg font-semibold text-ink-900">This room’s loads</h3>
        <EstimateBadge />
      </div>
      {!room ? <p className="text-muted">Fix the fields marked in red to update the loads.</p> : null}
      {result && !result.ok ? <p className="text-muted">{result.message}</p> : null}
      {result?.ok ? (
        <>
          <LoadFigures load={result.value} />
          <LazyComponentChart
            sensible={result.value.sensibleGain}
            latent={result.value.latentGain}
            heatLoss={result.value.heatLoss}
            roomName={result.value.roomName}
          />
        </>
      ) : null}
      {warnings.length > 0 ? (
        <Alert tone="warning" title="Worth a second look">
          <ul className="list-disc pl-5">
            {warnings.map((w) => (
              <li key={`${w.path.join('.')}:${w.message}`}>{w.message}</li>
            ))}
          </ul>
        </Alert>
      ) : null}
    </section>
  );
}
