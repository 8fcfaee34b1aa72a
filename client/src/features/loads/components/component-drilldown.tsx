import type { RoomLoad } from '@calc';
import { hourLabel } from './home-totals';
import { groupedNumber } from '../../../lib/grouped-number';

const n = groupedNumber;
const FACING: Record<string, string> = {
  N: 'north',
  NE: 'north-east',
  E: 'east',
  SE: 'south-east',
  S: 'south',
  SW: 'south-west',
  W: 'west',
  NW: 'north-west',
};

interface Row {
  readonly label: string;
  readonly detail?: string;
  readonly sensible: number;
  readonly heat?: number;
  readonly sub?: boolean;
}

/** The rows of the drill-down: each component at the room's peak hour, walls and windows by façade. */
export function drilldownRows(load: RoomLoad): Row[] {
  const s = load.sensibleGain;
  const h = load.heatLoss;
  const rows: Row[] = [{ label: 'Walls', sensible: s.walls, heat: h.walls }];
  for (const f of load.atPeak.facades)
    if (f.netWallFt2 > 0)
      rows.push({
        label: `facing ${FACING[f.direction] ?? f.direction}`,
        detail: `${n(f.netWallFt2)} ft² net`,
        sensible: f.wallsBtuh,
        sub: true,
      });
  rows.push({ label: 'Windows', sensible: s.windowsConduction + s.windowsSolar, heat: h.windowsConduction });
  for (const f of load.atPeak.facades)
    if (f.windowFt2 > 0)
      rows.push({
        label: `facing ${FACING[f.direction] ?? f.direction}`,
        detail: `${n(f.windowFt2)} ft²: conduction ${n(f.windowsConductionBtuh)} + sun ${n(f.windowsSolarBtuh)}`,
        sensible: f.windowsConductionBtuh + f.windowsSolarBtuh,
        sub: true,
      });
  if (s.doors > 0 || h.doors > 0) rows.push({ label: 'Doors', sensible: s.doors, heat: h.doors });
  rows.push({ label: 'Roof or ceiling', sensible: s.ceiling, heat: h.ceiling });
  rows.push({ label: 'Floor', sensible: s.floor, heat: h.floor });
  rows.push({
    label: 'Air leakage',
    detail: `${load.infiltrationCfm} cfm summer, ${load.infiltrationHeatingCfm} cfm winter`,
    sensible: s.infiltration,
    heat: h.infiltration,
  });
  rows.push({
    label: 'Ventilation',
    detail: `${load.ventilationCfm} cfm`,
    sensible: s.ventilation,
    heat: h.ventilation,
  });
  rows.push({
    label: 'Internal gains',
    detail: `people ${n(s.people)} + appliances ${n(s.appliances)}`,
    sensible: s.people + s.appliances,
    heat: 0,
  });
  if (s.ducts > 0 || h.ducts > 0) rows.push({ label: 'Ducts', sensible: s.ducts, heat: h.ducts });
  return rows;
}

/** Expandable: what makes up the room's peak sensible gain (and its heat loss), from calc's figures. */
export function ComponentDrilldown({ load }: { load: RoomLoad }) {
  const rows = drilldownRows(load);
  return (
    <details className="rounded-md border border-line">
      <summary className="flex min-h-11 cursor-pointer items-center px-3 font-semibold text-ink-900">
        What makes up the peak ({hourLabel(load.peakHour)})
      </summary>
      <div className="overflow-x-auto px-3 pb-3">
        <table className="w-full text-sm">
          <caption className="sr-only">
            {load.roomName}: sensible gain at {hourLabel(load.peakHour)} and heat loss, by part, Btu/h
          </caption>
          <thead>
            <tr className="text-left text-muted">
              <th scope="col" className="py-1 pr-2 font-normal">
                Part
              </th>
              <th scope="col" className="py-1 pr-2 text-right font-normal">
                Gain at {hourLabel(load.peakHour)}
              </th>
              <th scope="col" className="py-1 text-right font-normal">
                Heat loss
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={`${r.label}-${i}`} className={r.sub ? 'text-muted' : 'border-t border-line text-ink-900'}>
                <th scope="row" className={`py-1 pr-2 text-left font-normal ${r.sub ? 'pl-4' : ''}`}>
                  {r.label}
                  {r.detail ? <span className="block text-xs text-muted">{r.detail}</span> : null}
                </th>
                <td className="py-1 pr-2 text-right tabular-nums">{n(r.sensible)}</td>
                <td className="py-1 text-right tabular-nums">{r.heat === undefined ? '' : n(r.heat)}</td>
              </tr>
            ))}
            <tr className="border-t-2 border-ink-900 font-semibold text-ink-900">
              <th scope="row" className="py-1 pr-2 text-left">
                Sensible total
              </th>
              <td className="py-1 pr-2 text-right tabular-nums">{n(load.sensibleGain.total)}</td>
              <td className="py-1 text-right tabular-nums">{n(load.heatLoss.total)}</td>
            </tr>
            <tr className="text-ink-900">
              <th scope="row" className="py-1 pr-2 text-left font-normal">
                Latent (moisture)
              </th>
              <td className="py-1 pr-2 text-right tabular-nums">{n(load.latentGain.total)}</td>
              <td className="py-1 text-right" />
            </tr>
          </tbody>
        </table>
      </div>
    </details>
  );
}
