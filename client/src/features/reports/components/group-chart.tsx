import { Bar, BarChart, CartesianGrid, LabelList, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import type { WinGroup } from '@contract';
import { formatMoney } from '@calc';

const TEAL = '#2b575d';
const AMBER = '#b86e0c';

export const percent = (rate: number | null) => (rate === null ? '—' : `${Math.round(rate * 100)} %`);
export const money = (cents: number | null) => (cents === null ? '—' : formatMoney(cents, { whole: true }));

/** "54 % · 27 of 50": the win rate and what it is made of, beside each bar and in the table. */
export const winWords = (g: WinGroup) =>
  g.decided === 0 ? 'none decided yet' : `${percent(g.winRate)} · ${g.won} of ${g.decided}`;

/**
 * One breakdown of the win rate: horizontal bars (one per group, labels on the left so long names stay whole at
 * 375 px) with the rate and its counts beside each bar, and the same figures as a table with the revenue. The
 * chart is a picture of the table (hidden from screen readers, which read the table).
 */
export function GroupBreakdown({
  id,
  title,
  lead,
  groups,
  head,
  countLabel = 'Proposals',
}: {
  id: string;
  title: string;
  lead: string;
  groups: readonly WinGroup[];
  /** The first column's heading (what each row is). */
  head: string;
  countLabel?: string;
}) {
  const data = groups.map((g) => ({
    label: g.label,
    rate: g.winRate === null ? 0 : Math.round(g.winRate * 1000) / 10,
    words: winWords(g),
  }));
  const height = Math.max(120, data.length * 34 + 36);
  return (
    <section aria-labelledby={`${id}-title`} className="rounded-lg border border-line bg-white p-4 shadow-card sm:p-6">
      <h2 id={`${id}-title`} className="text-lg font-semibold text-ink-900">
        {title}
      </h2>
      <p className="mt-1 max-w-prose text-sm text-muted">{lead}</p>
      {groups.length === 0 ? (
        <p className="mt-4 text-base text-ink-900">No proposals in this range.</p>
      ) : (
        <div className="mt-4 grid gap-6 xl:grid-cols-2">
          <div aria-hidden="true" className="w-full" style={{ height }} data-testid={`${id}-chart`}>
            <ResponsiveContainer width="100%" height="100%">
              <BarChart
                accessibilityLayer={false}
                data={data}
                layout="vertical"
                margin={{ top: 4, right: 120, bottom: 4, left: 4 }}
              >
                <CartesianGrid stroke="#dedbd3" strokeDasharray="3 3" horizontal={false} />
                <XAxis type="number" domain={[0, 100]} unit=" %" fontSize={12} tickCount={6} />
                <YAxis type="category" dataKey="label" width={128} fontSize={12} interval={0} />
                <Bar dataKey="rate" fill={TEAL} isAnimationActive={false} barSize={18}>
                  <LabelList dataKey="words" position="right" fontSize={12} fill="#1f2a2c" />
                </Bar>
              </BarChart>
            </ResponsiveContainer>
          </div>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`${title}: the figures`}>
            <table className="w-full border-collapse text-sm">
              <caption className="sr-only">{title}: the figures</caption>
              <thead>
                <tr className="border-b border-line text-left text-ink-900">
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    {head}
                  </th>
                  <th scope="col" className="py-2 pr-3 text-right font-semibold">
                    {countLabel}
                  </th>
                  <th scope="col" className="py-2 pr-3 text-right font-semibold">
                    Won / decided
                  </th>
                  <th scope="col" className="py-2 pr-3 text-right font-semibold">
                    Win rate
                  </th>
                  <th scope="col" className="py-2 text-right font-semibold">
                    Revenue
                  </th>
                </tr>
              </thead>
              <tbody>
                {groups.map((g) => (
                  <tr key={g.key} className="border-b border-line/60 last:border-0">
                    <th scope="row" className="py-2 pr-3 text-left font-normal text-ink-900">
                      {g.label}
                    </th>
                    <td className="py-2 pr-3 text-right tabular-nums">{g.proposals}</td>
                    <td className="py-2 pr-3 text-right tabular-nums">
                      {g.won} / {g.decided}
                    </td>
                    <td className="py-2 pr-3 text-right tabular-nums">{percent(g.winRate)}</td>
                    <td className="py-2 text-right tabular-nums">{money(g.revenueCents)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      )}
    </section>
  );
}

/** Counts by a label (outstanding ages, lost reasons): bars with the count beside, and the table. */
export function CountBreakdown({
  id,
  title,
  lead,
  rows,
  head,
}: {
  id: string;
  title: string;
  lead: string;
  rows: readonly { key: string; label: string; count: number }[];
  head: string;
}) {
  const height = Math.max(120, rows.length * 34 + 36);
  return (
    <section aria-labelledby={`${id}-title`} className="rounded-lg border border-line bg-white p-4 shadow-card sm:p-6">
      <h2 id={`${id}-title`} className="text-lg font-semibold text-ink-900">
        {title}
      </h2>
      <p className="mt-1 max-w-prose text-sm text-muted">{lead}</p>
      {rows.length === 0 ? (
        <p className="mt-4 text-base text-ink-900">None in this range.</p>
      ) : (
        <div className="mt-4 grid gap-6 xl:grid-cols-2">
          <div aria-hidden="true" className="w-full" style={{ height }}>
            <ResponsiveContainer width="100%" height="100%">
              <BarChart
                accessibilityLayer={false}
                data={[...rows]}
                layout="vertical"
                margin={{ top: 4, right: 48, bottom: 4, left: 4 }}
              >
                <CartesianGrid stroke="#dedbd3" strokeDasharray="3 3" horizontal={false} />
                <XAxis type="number" allowDecimals={false} fontSize={12} />
                <YAxis type="category" dataKey="label" width={128} fontSize={12} interval={0} />
                <Bar dataKey="count" fill={AMBER} isAnimationActive={false} barSize={18}>
                  <LabelList dataKey="count" position="right" fontSize={12} fill="#1f2a2c" />
                </Bar>
              </BarChart>
            </ResponsiveContainer>
          </div>
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">{title}: the figures</caption>
            <thead>
              <tr className="border-b border-line text-left text-ink-900">
                <th scope="col" className="py-2 pr-3 font-semibold">
                  {head}
                </th>
                <th scope="col" className="py-2 text-right font-semibold">
                  Proposals
                </th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.key} className="border-b border-line/60 last:border-0">
                  <th scope="row" className="py-2 pr-3 text-left font-normal text-ink-900">
                    {r.label}
                  </th>
                  <td className="py-2 text-right tabular-nums">{r.count}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
