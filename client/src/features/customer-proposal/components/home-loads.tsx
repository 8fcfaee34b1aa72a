import { LOADS_ESTIMATE_NOTE, type CustomerProposalView } from '@contract';
import { groupedNumber } from '../../../lib/grouped-number';
import { btuh } from './format';

/** The home's heating and cooling needs: the whole home first, each room in a fold; always called an estimate. */
export function HomeLoads({ loads }: { loads: CustomerProposalView['loads'] }) {
  return (
    <section aria-labelledby="loads-heading" className="rounded-lg border border-line bg-white p-4 shadow-card sm:p-6">
      <h2 id="loads-heading" className="text-xl font-semibold text-ink-900">
        What your home needs
      </h2>
      <p className="mt-1 text-base text-muted">{LOADS_ESTIMATE_NOTE}</p>
      <dl className="mt-4 grid grid-cols-2 gap-3">
        <div className="rounded-md bg-ink-50 p-3">
          <dt className="text-sm font-semibold text-ink-800">Cooling, whole home</dt>
          <dd className="whitespace-nowrap text-lg font-semibold text-cooling sm:text-xl">
            {btuh(loads.home.coolingBtuh)}
          </dd>
        </div>
        <div className="rounded-md bg-ink-50 p-3">
          <dt className="text-sm font-semibold text-ink-800">Heating, whole home</dt>
          <dd className="whitespace-nowrap text-lg font-semibold text-heating sm:text-xl">
            {btuh(loads.home.heatingBtuh)}
          </dd>
        </div>
      </dl>
      <p className="mt-2 text-sm text-muted">{groupedNumber(loads.home.floorAreaFt2)} ft² of conditioned floor.</p>
      <details className="mt-4 rounded-md border border-line">
        <summary className="min-h-touch cursor-pointer px-3 py-2 text-base font-semibold text-ink-800">
          Room by room ({loads.rooms.length})
        </summary>
        <div className="overflow-x-auto px-3 pb-3">
          <table className="w-full text-left text-base">
            <thead>
              <tr className="border-b border-line text-sm text-muted">
                <th scope="col" className="py-2 pr-2 font-semibold">
                  Room
                </th>
                <th scope="col" className="py-2 pr-2 text-right font-semibold">
                  Cooling
                </th>
                <th scope="col" className="py-2 text-right font-semibold">
                  Heating
                </th>
              </tr>
            </thead>
            <tbody>
              {loads.rooms.map((r, i) => (
                <tr key={`${i}-${r.name}`} className="border-b border-line last:border-0">
                  <th scope="row" className="py-2 pr-2 font-normal">
                    {r.name}
                    <span className="block text-sm text-muted">{groupedNumber(r.floorAreaFt2)} ft²</span>
                  </th>
                  <td className="py-2 pr-2 text-right tabular-nums">{btuh(r.coolingBtuh)}</td>
                  <td className="py-2 text-right tabular-nums">{btuh(r.heatingBtuh)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-3 text-sm text-muted">{loads.method}</p>
        </div>
      </details>
    </section>
  );
}
