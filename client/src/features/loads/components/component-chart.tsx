import type { LoadComponents } from '@calc';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { COMPONENT_KEYS, COMPONENT_LABELS } from '../model/compute';

interface Props {
  sensible: LoadComponents;
  latent: LoadComponents;
  heatLoss: LoadComponents;
}

/** Where the load comes from, one bar pair per component (cooling gain vs heat loss), Btu/h. */
export function ComponentChart({ sensible, latent, heatLoss }: Props) {
  const data = COMPONENT_KEYS.map((k) => ({
    name: COMPONENT_LABELS[k],
    cooling: sensible[k] + latent[k],
    heating: heatLoss[k],
  }));
  const summary = data.map((d) => `${d.name}: ${d.cooling} Btu/h cooling, ${d.heating} Btu/h heating`).join('; ');
  return (
    <figure className="h-[300px] w-full min-w-0">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} layout="vertical" margin={{ left: 0, right: 12 }} accessibilityLayer>
          <CartesianGrid strokeDasharray="3 3" horizontal={false} />
          <XAxis type="number" tick={{ fontSize: 12 }} />
          <YAxis type="category" dataKey="name" width={112} tick={{ fontSize: 11 }} />
          <Tooltip formatter={(v) => `${String(v)} Btu/h`} />
          <Legend />
          <Bar dataKey="cooling" name="Cooling gain" fill="var(--color-amber)" isAnimationActive={false} />
          <Bar dataKey="heating" name="Heat loss" fill="var(--color-ink-500)" isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
      <figcaption className="sr-only">{summary}</figcaption>
    </figure>
  );
}
