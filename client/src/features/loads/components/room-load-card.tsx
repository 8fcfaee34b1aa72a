import { roomPlausibilityWarnings, type Room, type RoomLoad } from '@calc';
import { ComponentDrilldown } from './component-drilldown';
import { LazyComponentChart } from './lazy-component-chart';
import { LoadFigures } from './load-figures';

/** One room on the loads page: the figures, the breakdown and any plain-word warnings. */
export function RoomLoadCard({
  load,
  room,
  ducts = false,
}: {
  load: RoomLoad;
  room: Room | undefined;
  /** A ducted system serves the home: the breakdown has a "Ducts" row. */
  ducts?: boolean;
}) {
  const warnings = room ? roomPlausibilityWarnings(room) : [];
  return (
    <article
      aria-label={`Loads for ${load.roomName}`}
      className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
    >
      <h3 className="text-lg font-semibold text-ink-900">
        {load.roomName} <span className="text-sm font-normal text-muted">{load.floorAreaFt2} ft²</span>
      </h3>
      <LoadFigures load={load} />
      <LazyComponentChart
        sensible={load.sensibleGain}
        latent={load.latentGain}
        heatLoss={load.heatLoss}
        roomName={load.roomName}
        ducts={ducts}
      />
      <ComponentDrilldown load={load} />
      {warnings.length > 0 ? (
        <ul className="list-disc pl-5 text-sm text-amber-deep">
          {warnings.map((w) => (
            <li key={`${w.path.join('.')}:${w.message}`}>{w.message}</li>
          ))}
        </ul>
      ) : null}
    </article>
  );
}
