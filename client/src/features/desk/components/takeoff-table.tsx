import { formatMoney, formatNumber } from '@calc';
import type { TakeoffLineRecord } from '@contract';

/**
 * The takeoff calc generated from the design, priced from the price book (unit costs for the office only).
 * Where an edit changed a line, the generated value stands beside the edited one.
 */
export function TakeoffTable({ lines }: { lines: readonly TakeoffLineRecord[] }) {
  const costs = lines.some((l) => l.unitCostCents !== undefined);
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Materials and labor</caption>
        <thead>
          <tr className="border-b border-line text-left text-muted">
            <th scope="col" className="py-2 pr-3">
              Item
            </th>
            <th scope="col" className="py-2 pr-3 text-right">
              Quantity
            </th>
            {costs ? (
              <>
                <th scope="col" className="py-2 pr-3 text-right">
                  Unit cost
                </th>
                <th scope="col" className="py-2 text-right">
                  Cost
                </th>
              </>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => {
            const qtyEdited = l.generatedQuantity !== null && l.generatedQuantity !== l.quantity;
            const costEdited =
              l.generatedUnitCostCents !== undefined &&
              l.generatedUnitCostCents !== null &&
              l.generatedUnitCostCents !== l.unitCostCents;
            return (
              <tr key={l.itemKey} className="border-b border-line align-top">
                <th scope="row" className="py-2 pr-3 text-left font-normal">
                  <span className="font-semibold text-ink-900">{l.description}</span>
                  <span className="block text-muted">{l.derivation}</span>
                </th>
                <td className="py-2 pr-3 text-right tabular-nums">
                  {formatNumber(l.quantity, 2, { trim: true })} {l.unit}
                  {qtyEdited ? (
                    <span className="block text-amber-deep">
                      generated {formatNumber(l.generatedQuantity ?? 0, 2, { trim: true })}
                    </span>
                  ) : null}
                </td>
                {costs ? (
                  <>
                    <td className="py-2 pr-3 text-right tabular-nums">
                      {l.unitCostCents === null || l.unitCostCents === undefined
                        ? 'no price'
                        : formatMoney(l.unitCostCents)}
                      {costEdited ? (
                        <span className="block text-amber-deep">
                          generated {formatMoney(l.generatedUnitCostCents ?? 0)}
                        </span>
                      ) : null}
                    </td>
                    <td className="py-2 text-right tabular-nums">{formatMoney(l.extendedCostCents ?? 0)}</td>
                  </>
                ) : null}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
