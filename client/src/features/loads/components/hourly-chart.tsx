import type { HomeHour } from '@calc';
import { Area, AreaChart, CartesianGrid, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { groupedNumber } from '../../../lib/grouped-number';

const n = groupedNumber;

/** The whole home's sensible gain through the design day, with the block hour marked. Loaded on demand. */
export default function HourlyChart({ hours, blockHour }: { hours: readonly HomeHour[]; blockHour: number }) {
  const data = hours.map((h) => ({ hour: h.hour, sensible: h.sensibleBtuh, sun: h.windowsSolarBtuh }));
  const summary = hours.map((h) => `${h.hour}:00 ${n(h.sensibleBtuh)} Btu/h`).join('; ');
  return (
    <figure className="h-[220px] w-full min-w-0">
      <ResponsiveContainer width="100%" height="100%">
        <AreaChart data={data} margin={{ left: 0, right: 12, top: 8 }} accessibilityLayer>
          <CartesianGrid strokeDasharray="3 3" vertical={false} />
          <XAxis dataKey="hour" tick={{ fontSize: 12 }} ticks={[3, 6, 9, 12, 15, 18, 21, 24]} />
          <YAxis tick={{ fontSize: 12 }} width={56} />
          <Tooltip
            labelFormatter={(h) => `${String(h)}:00 solar time`}
            formatter={(v, name) => [`${n(Number(v))} Btu/h`, name === 'sun' ? 'Sun through glass' : 'Sensible gain']}
          />
          <Area
            type="monotone"
            dataKey="sensible"
            stroke="var(--color-ink-500)"
            fill="var(--color-ink-200)"
            isAnimationActive={false}
          />
          <Area
            type="monotone"
            dataKey="sun"
            stroke="var(--color-amber)"
            fill="var(--color-amber-soft)"
            isAnimationActive={false}
          />
          <ReferenceLine x={blockHour} stroke="var(--color-amber-deep)" strokeDasharray="4 2" />
        </AreaChart>
      </ResponsiveContainer>
      <figcaption className="sr-only">Sensible gain of the whole home each hour: {summary}</figcaption>
    </figure>
  );
}
