import type { HomeLoad } from '@calc';
import { EstimateBadge } from './estimate-note';

const n = (v: number) => v.toLocaleString('en-US');

/** Whole-home totals and the sensible heat ratio. */
export function HomeTotals({ load, skipped = [] }: { load: HomeLoad; skipped?: readonly string[] }) {
  const t = load.totals;
  const rows: [string, string][] = [
    ['Sensible gain', `${n(t.sensibleBtuh)} Btu/h`],
    ['Latent gain', `${n(t.latentBtuh)} Btu/h`],
    ['Total cooling', `${n(t.coolingBtuh)} Btu/h`],
    ['Cooling', `${t.coolingTons} tons`],
    ['Heat loss', `${n(t.heatingBtuh)} Btu/h`],
    ['Sensible heat ratio', t.sensibleHeatRatio.toFixed(2)],
    ['Floor area', `${n(t.floorAreaFt2)} ft²`],
  ];
  return (
    <section
      aria-label="Whole-home loads"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4"
    >
      <div className="flex items-center gap-3">
        <h2 className="text-lg font-semibold text-ink-900">Whole home</h2>
        <EstimateBadge />
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-4">
        {rows.map(([label, value]) => (
          <div key={label}>
            <dt className="text-sm text-muted">{label}</dt>
            <dd className="text-lg font-semibold text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
      {skipped.length > 0 ? (
        <p className="text-sm text-amber-deep">Not counted until their fields are fixed: {skipped.join(', ')}.</p>
      ) : null}
    </section>
  );
}
