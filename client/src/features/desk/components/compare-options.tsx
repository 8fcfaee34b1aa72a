import { formatMoney, formatNumber } from '@calc';
import type { OptionRecord } from '@contract';
import type { DeskModel } from '../api/get-models';

interface Row {
  readonly label: string;
  readonly values: readonly string[];
}

function rowsOf(options: readonly OptionRecord[], models: readonly DeskModel[]): Row[] {
  const model = (key: string) => models.find((m) => m.key === key);
  const outdoor = (o: OptionRecord) => (o.result?.systems ?? []).map((s) => model(s.outdoorUnitKey));
  const worst = (xs: (number | null | undefined)[], pick: 'min' | 'max') => {
    const n = xs.filter((x): x is number => typeof x === 'number');
    return n.length === 0 ? '—' : formatNumber(pick === 'min' ? Math.min(...n) : Math.max(...n), 1, { trim: true });
  };
  const money = (
    o: OptionRecord,
    f: (p: NonNullable<NonNullable<OptionRecord['result']>['price']>) => number | null,
  ) => {
    const p = o.result?.price;
    const v = p ? f(p) : null;
    return v === null ? '—' : formatMoney(v);
  };
  const rows: Row[] = [
    { label: 'Zones', values: options.map((o) => String(o.result?.zones.length ?? '—')) },
    {
      label: 'Outdoor units',
      values: options.map((o) => (o.result?.systems ?? []).map((s) => s.outdoorUnitKey).join(', ') || '—'),
    },
    {
      label: 'Efficiency (lowest SEER2)',
      values: options.map((o) =>
        worst(
          outdoor(o).map((m) => m?.seer2),
          'min',
        ),
      ),
    },
    {
      label: 'Sound (loudest outdoor, dBA)',
      values: options.map((o) =>
        worst(
          outdoor(o).map((m) => m?.soundDba),
          'max',
        ),
      ),
    },
  ];
  if (options.some((o) => o.result?.price))
    rows.push(
      { label: 'Total', values: options.map((o) => money(o, (p) => p.totalCents)) },
      { label: 'Deposit', values: options.map((o) => money(o, (p) => p.depositCents)) },
      {
        label: 'Monthly (lowest)',
        values: options.map((o) => {
          const m = (o.result?.monthly ?? []).map((x) => x.monthlyPaymentCents);
          return m.length === 0 ? '—' : formatMoney(Math.min(...m));
        }),
      },
    );
  return rows;
}

/** The options side by side; a row whose values differ is highlighted, so what sets them apart shows at a glance. */
export function CompareOptions({
  options,
  models,
}: {
  options: readonly OptionRecord[];
  models: readonly DeskModel[];
}) {
  if (options.length < 2) return null;
  const rows = rowsOf(options, models);
  return (
    <section aria-labelledby="compare-heading" className="rounded-lg border border-line bg-white p-4">
      <h2 id="compare-heading" className="text-lg font-semibold text-ink-900">
        Options side by side
      </h2>
      <p className="text-sm text-muted">Rows where the options differ are highlighted.</p>
      {/* Three options may not fit a phone: the table scrolls in its own region, reachable by keyboard. */}
      <div role="region" aria-label="Options compared" tabIndex={0} className="overflow-x-auto">
        <table className="mt-2 w-full border-collapse text-sm">
          <thead>
            <tr className="border-b border-line text-left">
              <th scope="col" className="py-2 pr-3 text-muted">
                <span className="sr-only">What</span>
              </th>
              {options.map((o) => (
                <th key={o.id} scope="col" className="py-2 pr-3">
                  {o.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => {
              const differs = new Set(r.values).size > 1;
              return (
                <tr key={r.label} className={`border-b border-line ${differs ? 'bg-amber-soft' : ''}`}>
                  <th scope="row" className="py-2 pr-3 text-left font-normal text-muted">
                    {r.label}
                    {differs ? <span className="sr-only"> (differs)</span> : null}
                  </th>
                  {r.values.map((v, i) => (
                    <td
                      key={options[i]?.id ?? i}
                      className={`py-2 pr-3 whitespace-nowrap tabular-nums ${differs ? 'font-semibold' : ''}`}
                    >
                      {v}
                    </td>
                  ))}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}
