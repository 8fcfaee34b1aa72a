import type { LoadComponents } from '@calc';
import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { COMPONENT_KEYS, COMPONENT_LABELS } from '../model/compute';

interface Props {
  sensible: LoadComponents;
  latent: LoadComponents;
  heatLoss: LoadComponents;
  width?: number;
}

/** Where the load comes from, one bar pair per component (cooling gain vs heat loss), Btu/h. */
export function ComponentChart({ sensible, latent, heatLoss, width = 340 }: Props) {
  const data = COMPONENT_KEYS.map((k) => ({ name: COMPONENT_LABELS[k], cooling: sensible[k] + latent[k], heating: heatLoss[k] }));
  const summary = data.map((d) => `${d.name}: ${d.cooling} Btu/h cooling, ${d.heating} Btu/h heating`).join('; ');
  return (
    <figure className="overflow-x-auto">
      <BarChart width={width} height={300} data={data} layout="vertical" margin={{ left: 8, right: 16 }} accessibilityLayer>
        <CartesianGrid strokeDasharray="3 3" horizontal={false} />
        <XAxis type="number" tick={{ fontSize: 12 }} />
        <YAxis type="category" dataKey="name" width={130} tick={{ fontSize: 12 }} />
        <Tooltip formatter={(v) => `${String(v)} Btu/h`} />
        <Legend />
        <Bar dataKey="cooling" name="Cooling gain" fill="var(--color-amber)" isAnimationActive={false} />
        <Bar dataKey="heating" name="Heat loss" fill="var(--color-ink-500)" isAnimationActive={false} />
      </BarChart>
      <figcaption className="sr-only">{summary}</figcaption>
    </figure>
  );
}
