import { lazy, Suspense, type ComponentProps } from 'react';
import { useNearView } from '../../../lib/use-near-view';
import type { HomeLoad } from '@calc';
import { EstimateBadge } from './estimate-badge';
import { groupedNumber } from '../../../lib/grouped-number';

const HourlyChart = lazy(() => import('./hourly-chart'));

const drawing = <p className="h-[220px] text-sm text-muted">Drawing the design day…</p>;

/** The hour-by-hour chart, fetched and drawn once its place is on or near the screen (lib/use-near-view.ts). */
function NearHourlyChart(props: ComponentProps<typeof HourlyChart>) {
  const [ref, near] = useNearView<HTMLDivElement>();
  if (!near)
    return (
      <div ref={ref} className="h-[220px]">
        {drawing}
      </div>
    );
  return (
    <Suspense fallback={drawing}>
      <HourlyChart {...props} />
    </Suspense>
  );
}

const n = groupedNumber;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "15:00" for a design-day hour (solar time). */
export const hourLabel = (h: number) => `${String(h).padStart(2, '0')}:00`;

/** The design day in words: latitude, the 21st of the month, and where the clear sky comes from. */
export function designDayLine(load: HomeLoad): string {
  const d = load.designDay;
  const lat = `${Math.abs(d.latitudeDeg)}° ${d.latitudeDeg < 0 ? 'S' : 'N'}${d.latitudeAssumed ? ' (assumed: no latitude entered)' : ''}`;
  const sky = d.skyIsGeneric
    ? `generic clear sky τb ${d.tauB} / τd ${d.tauD} — not the site’s data`
    : `clear sky τb ${d.tauB} / τd ${d.tauD} (${d.skySource})`;
  const ground = !d.belowGrade
    ? ''
    : d.groundAssumed
      ? ` Basement walls and floors: no ground temperature entered, so the outdoor heating design ${d.groundDesignF} °F stands in (overstates their loss).`
      : ` Basement walls and floors: design ground temperature ${d.groundDesignF} °F.`;
  const mass = `Heat stored by the rooms: ASHRAE radiant time series, ${d.thermalMass} construction${d.thermalMassAssumed ? ' (the default: none chosen for the house)' : ''}.`;
  return `Design day ${MONTHS[d.month - 1] ?? ''} 21 at ${lat}; ${sky}. ${mass}${ground}`;
}

const DUCT_PLACE: Record<string, string> = {
  attic: 'the attic',
  crawlspace: 'a crawl space',
  garage: 'the garage',
  basement: 'an unheated basement',
  conditioned: 'the conditioned space',
};

/** The ducts in words: where, how insulated and leaky, and what they add (ASHRAE 152 balance). */
export function ductLine(d: NonNullable<HomeLoad['ducts']>): string {
  const pct = (f: number) => `${Math.round(f * 100)} %`;
  return (
    `Ducts in ${DUCT_PLACE[d.location] ?? d.location} (R-${d.insulationR} insulation, working as R-${d.supplyEffectiveR} supply / R-${d.returnEffectiveR} return, leakage ${pct(d.supplyLeakageFraction)} supply / ${pct(d.returnLeakageFraction)} return, ${n(d.airflowCfm)} cfm, ${n(d.supplyAreaFt2)} ft² supply): ` +
    `+${n(d.cooling.sensibleBtuh)} Btu/h sensible and +${n(d.cooling.latentBtuh)} Btu/h latent at ${hourLabel(d.cooling.hour)} (surroundings ${d.cooling.surroundingsF} °F), ` +
    `+${n(d.heating.btuh)} Btu/h heat loss (surroundings ${d.heating.surroundingsF} °F). ` +
    `Delivery effectiveness ${d.cooling.deliveryEffectiveness.toFixed(2)} cooling, ${d.heating.deliveryEffectiveness.toFixed(2)} heating (ASHRAE Standard 152 balance). ` +
    `Working R: insulation wrapped round a flex duct does less than its label says, and the air films add a little, so the duct is worked at the measured round-duct R (Palmiter and Kruse 2006; 6 in supply, 14 in return).`
  );
}

/**
 * Whole-home totals: the block (coincident) load at the home's peak hour beside the sum of the
 * rooms' own peaks, the sensible heat ratio, heat loss; on the loads page also the hour-by-hour curve.
 */
export function HomeTotals({
  load,
  skipped = [],
  chart = false,
}: {
  load: HomeLoad;
  skipped?: readonly string[];
  chart?: boolean;
}) {
  const t = load.totals;
  const b = load.block;
  const rows: [string, string][] = [
    ['Total cooling (block)', `${n(t.coolingBtuh)} Btu/h`],
    ['Cooling', `${t.coolingTons} tons`],
    ['Sensible gain', `${n(t.sensibleBtuh)} Btu/h`],
    ['Latent gain', `${n(t.latentBtuh)} Btu/h`],
    ['Heat loss', `${n(t.heatingBtuh)} Btu/h`],
    ['Sensible heat ratio', t.sensibleHeatRatio.toFixed(2)],
    ['Home peaks at', `${hourLabel(b.hour)} solar time`],
    ['Floor area', `${n(t.floorAreaFt2)} ft²`],
  ];
  const share =
    b.sumOfRoomPeaksSensibleBtuh > 0 ? Math.round((b.sensibleBtuh / b.sumOfRoomPeaksSensibleBtuh) * 100) : 100;
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
      <p className="text-sm text-ink-950" data-testid="block-vs-peaks">
        Block sensible load {n(b.sensibleBtuh)} Btu/h at {hourLabel(b.hour)} against {n(b.sumOfRoomPeaksSensibleBtuh)}{' '}
        Btu/h if every room peaked at once ({share} %): rooms peak at different hours, so equipment is sized on the
        block load.
      </p>
      {load.ducts && load.ducts.location !== 'conditioned' ? (
        <p className="text-sm text-ink-950" data-testid="duct-line">
          {ductLine(load.ducts)}
        </p>
      ) : null}
      <p className="text-sm text-muted">{designDayLine(load)}</p>
      {chart ? (
        <div className="flex flex-col gap-1">
          <p className="text-sm font-semibold text-ink-900">The design day, hour by hour (Btu/h, solar time)</p>
          <p className="text-sm text-muted">
            Grey: the whole home’s sensible gain. Amber: sun through glass. Dashed line: the block hour.
          </p>
          <NearHourlyChart hours={load.hourly} blockHour={b.hour} />
        </div>
      ) : null}
      {skipped.length > 0 ? (
        <p className="text-sm text-amber-deep">Not counted until their fields are fixed: {skipped.join(', ')}.</p>
      ) : null}
    </section>
  );
}
