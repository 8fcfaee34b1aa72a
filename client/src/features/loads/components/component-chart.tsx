import type { LoadComponents } from '@calc';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { COMPONENT_KEYS, COMPONENT_LABELS } from '../model/compute';
import { groupedNumber } from '../../../lib/grouped-number';

interface Props {
  sensible: LoadComponents;
  latent: LoadComponents;
  heatLoss: LoadComponents;
  /** Names the chart for screen readers, e.g. "Bedroom 2". */
  roomName?: string | undefined;
  /** True when a ducted system serves the home (house.ducts set); without one the "Ducts" row is left out. */
  ducts?: boolean | undefined;
}

const btuh = (n: number) => `${groupedNumber(Math.round(n))} Btu/h`;

/**
 * Where the load comes from, one bar pair per component (cooling gain vs heat loss), Btu/h.
 * Cool colour for cooling, warm for heating (both ≥ 3:1 on white). The drawing is not a
 * keyboard stop (nothing in it does anything); its figures are in the table under it.
 */
export function ComponentChart({ sensible, latent, heatLoss, roomName, ducts = false }: Props) {
  const data = COMPONENT_KEYS.filter((k) => ducts || k !== 'ducts').map((k) => ({
    name: COMPONENT_LABELS[k],
    cooling: sensible[k] + latent[k],
    heating: heatLoss[k],
  }));
  const title = roomName ? `Where ${roomName}'s load comes from` : "Where this room's load comes from";
  return (
    <figure aria-label={title} className="w-full min-w-0">
      <div className="h-[300px] w-full" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 600, height: 300 }}>
          <BarChart data={data} layout="vertical" margin={{ left: 0, right: 12 }} accessibilityLayer={false}>
            <CartesianGrid strokeDasharray="3 3" horizontal={false} />
            <XAxis type="number" tick={{ fontSize: 12 }} />
            <YAxis type="category" dataKey="name" width={112} tick={{ fontSize: 11 }} />
            <Tooltip formatter={(v) => btuh(Number(v))} />
            <Legend />
            <Bar dataKey="cooling" name="Cooling gain" fill="var(--color-cooling)" isAnimationActive={false} />
            <Bar dataKey="heating" name="Heat loss" fill="var(--color-heating)" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <details className="mt-1 text-sm">
        <summary className="min-h-11 cursor-pointer py-2 font-semibold text-ink-800">The figures as a table</summary>
        <table className="w-full text-left">
          <caption className="sr-only">{title}, Btu/h</caption>
          <thead>
            <tr>
              <th scope="col">Component</th>
              <th scope="col" className="text-right">
                Cooling gain
              </th>
              <th scope="col" className="text-right">
                Heat loss
              </th>
            </tr>
          </thead>
          <tbody>
            {data.map((d) => (
              <tr key={d.name} className="border-t border-line">
                <th scope="row" className="font-normal">
                  {d.name}
                </th>
                <td className="text-right tabular-nums">{btuh(d.cooling)}</td>
                <td className="text-right tabular-nums">{btuh(d.heating)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
