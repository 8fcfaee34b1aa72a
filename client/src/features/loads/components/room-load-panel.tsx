import type { PlausibilityWarning, Room, Tightness } from '@calc';
import { memo } from 'react';
import { Alert } from '../../../components/ui/alert';
import { engineWaitMessage, useLoadEngine } from './live-engine';
import { LazyComponentChart } from './lazy-component-chart';
import { EstimateBadge } from './estimate-badge';
import type { LiveHomeInputs } from '../model/live-room';

interface Props {
  /** The room as calc parsed it, or null while the form has errors. */
  room: Room | null;
  warnings: readonly PlausibilityWarning[];
  designConditions: Record<string, unknown> | null;
  tightness: Tightness;
  /** The other rooms and the house facts: the room's figures are its figures in the whole home. */
  home: LiveHomeInputs;
}

/**
 * This room's loads, recomputed in the browser on every change, as the whole home will have them:
 * with its share of the house's leakage, ventilation and default gains, and of the ducts when there are.
 * Memoised: the room editor hands it the room a beat behind the form (useDeferredValue), so a
 * keystroke's own render skips it (issue 11).
 */
export const RoomLoadPanel = memo(function RoomLoadPanel({ room, warnings, designConditions, tightness, home }: Props) {
  const engine = useLoadEngine({ ...home, designConditions, tightness });
  const parts = engine.status === 'ready' ? engine.engine : null;
  const result = room && parts ? parts.computeLiveRoomLoad(room, home, designConditions, tightness) : null;
  return (
    <section aria-label="Room loads" className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4">
      <div className="flex items-center gap-3">
        <h3 className="text-lg font-semibold text-ink-900">This room’s loads</h3>
        <EstimateBadge />
      </div>
      {!room ? <p className="text-muted">Fix the fields marked in red to update the loads.</p> : null}
      {room && engine.status !== 'ready' ? (
        <p className="text-muted" aria-live="polite">
          {engineWaitMessage(engine)}
        </p>
      ) : null}
      {result && !result.ok ? <p className="text-muted">{result.message}</p> : null}
      {result?.ok && parts ? (
        <>
          <parts.LoadFigures load={result.value} />
          <LazyComponentChart
            sensible={result.value.sensibleGain}
            latent={result.value.latentGain}
            heatLoss={result.value.heatLoss}
            roomName={result.value.roomName}
            ducts={result.ducts}
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
});
