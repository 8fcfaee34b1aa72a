import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

type Point = { outdoorF: number; btuh: number };
const pointsOf = (v: unknown): Point[] =>
  Array.isArray(v)
    ? v.filter(
        (p): p is Point =>
          typeof p === 'object' && p !== null && typeof p.outdoorF === 'number' && typeof p.btuh === 'number',
      )
    : [];

/** A model's rated capacity against outdoor temperature, cooling and heating. */
export function CapacityChart({ record }: { record: Readonly<Record<string, unknown>> }) {
  const cooling = pointsOf(record['coolingPoints']);
  const heating = pointsOf(record['heatingPoints']);
  if (cooling.length + heating.length === 0) return null;
  const temps = [...new Set([...cooling, ...heating].map((p) => p.outdoorF))].sort((a, b) => a - b);
  const data = temps.map((t) => ({
    outdoorF: t,
    cooling: cooling.find((p) => p.outdoorF === t)?.btuh ?? null,
    heating: heating.find((p) => p.outdoorF === t)?.btuh ?? null,
  }));
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-sm font-semibold text-ink-900">Rated capacity, Btu/h, by outdoor °F</figcaption>
      <div className="h-44 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 12, bottom: 4, left: 0 }}>
            <CartesianGrid stroke="#dedbd3" strokeDasharray="3 3" />
            <XAxis dataKey="outdoorF" type="number" domain={['dataMin', 'dataMax']} unit="°F" fontSize={12} />
            <YAxis fontSize={12} width={56} />
            <Tooltip />
            <Legend />
            <Line
              dataKey="cooling"
              name="Cooling"
              stroke="#2b575d"
              strokeWidth={2}
              connectNulls
              isAnimationActive={false}
            />
            <Line
              dataKey="heating"
              name="Heating"
              stroke="#e39b2d"
              strokeWidth={2}
              connectNulls
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
