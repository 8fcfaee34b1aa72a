import type { HomeLoad } from '@calc';
import type { JobRecord } from '@contract';
import { designDayLine, hourLabel } from './home-totals';
import { COMPONENT_KEYS, COMPONENT_LABELS, tons } from '../model/compute';
import { withoutSourceTags } from '../model/print-text';
import { monthName } from '../../../lib/months';
import { groupedNumber } from '../../../lib/grouped-number';

const n = groupedNumber;
const DESIGN_ROWS: [string, string, string][] = [
  ['outdoorCoolingDryBulbF', 'Outdoor cooling dry bulb', '°F'],
  ['outdoorCoolingWetBulbF', 'Outdoor coincident wet bulb', '°F'],
  ['outdoorCoolingGrains', 'Outdoor humidity', 'gr/lb'],
  ['outdoorHeatingDryBulbF', 'Outdoor heating dry bulb', '°F'],
  ['indoorCoolingF', 'Indoor cooling set point', '°F'],
  ['indoorHeatingF', 'Indoor heating set point', '°F'],
  ['indoorCoolingRhPercent', 'Indoor relative humidity', '%'],
  ['dailyRangeF', 'Daily range', '°F'],
  ['elevationFt', 'Elevation', 'ft'],
  ['latitudeDeg', 'Latitude', '°'],
  ['designMonth', 'Design month', ''],
  ['clearSkyTauB', 'Clear-sky τb', ''],
  ['clearSkyTauD', 'Clear-sky τd', ''],
];
const sourceWords: Record<string, string> = {
  entered: 'entered',
  'company-default': 'company default',
  'standard-default': 'standard default',
};

/** The plain-sentence method a homeowner reads; the office screens keep the full notes with their sources. */
export const PLAIN_METHOD =
  'Each room’s heat gain was worked out hour by hour through a hot design day, and its heat loss at the cold design temperature, following the ASHRAE Handbook—Fundamentals; the whole-home figure is the hour when all rooms together need the most cooling.';

/**
 * The customer's one-page load summary: who prepared it, for whom, the design conditions with the source as
 * the company wrote it, room and whole-home figures, the method in a sentence. No source tags or internal notes.
 */
export function LoadSummarySheet({
  job,
  load,
  companyName,
  printedOn,
  asOf,
  revision,
}: {
  job: JobRecord;
  load: HomeLoad;
  companyName: string;
  printedOn: string;
  asOf: string;
  revision: string;
}) {
  const dc = job.designConditions ?? {};
  const t = load.totals;
  const source = typeof dc.source === 'string' ? withoutSourceTags(dc.source) : '';
  return (
    <article className="load-sheet mx-auto flex max-w-[186mm] flex-col gap-3 bg-white p-4 text-sm text-ink-950">
      <header className="flex items-start justify-between border-b-2 border-ink-800 pb-2">
        <div>
          <p className="text-base font-semibold">{companyName}</p>
          <p className="text-xs font-semibold uppercase tracking-wide text-ink-600">Heating and cooling load summary</p>
          <h1 className="text-xl font-semibold">{job.customer.name}</h1>
          <p>
            {[job.site.street, job.site.unit, job.site.city, job.site.region, job.site.postalCode]
              .filter(Boolean)
              .join(', ')}
          </p>
        </div>
        <div className="text-right">
          <p className="rounded border border-ink-800 px-2 font-semibold">ESTIMATE</p>
          <p className="mt-1 text-xs">Figures as of {asOf}</p>
          <p className="text-xs">Printed {printedOn}</p>
          <p className="text-xs">Revision {revision}</p>
        </div>
      </header>

      <section aria-label="Inputs used">
        <h2 className="font-semibold">Design conditions used</h2>
        <dl className="grid grid-cols-1 gap-x-6 text-xs sm:grid-cols-2 print:grid-cols-2">
          {DESIGN_ROWS.filter(([k]) => typeof dc[k] === 'number').map(([k, label, unit]) => (
            <div key={k} className="flex justify-between gap-2 border-b border-line py-0.5">
              <dt>{label}</dt>
              <dd className="text-right">
                {k === 'designMonth' ? (monthName(dc[k]) ?? String(dc[k])) : `${String(dc[k])} ${unit}`}
                <span className="pl-2 text-muted">{sourceWords[job.designSources[k]?.source ?? ''] ?? ''}</span>
              </dd>
            </div>
          ))}
        </dl>
        <p className="text-xs">
          House tightness: {job.tightness}. {source ? `Source of design values: ${source}.` : ''}
        </p>
      </section>

      <section aria-label="Room results">
        <h2 className="font-semibold">Rooms (Btu/h)</h2>
        <table className="w-full text-xs [&_td]:pl-1.5 [&_th]:pl-1.5">
          <thead>
            <tr className="border-b border-ink-800 text-left">
              <th>Room</th>
              <th className="text-right">ft²</th>
              <th className="text-right">Sensible</th>
              <th className="text-right">Latent</th>
              <th className="text-right">Cooling</th>
              <th className="text-right">Tons</th>
              <th className="text-right">Heat loss</th>
              <th className="text-right">Peak</th>
            </tr>
          </thead>
          <tbody>
            {load.rooms.map((r) => (
              <tr key={r.roomId} className="border-b border-line">
                <td>{r.roomName}</td>
                <td className="text-right">{r.floorAreaFt2}</td>
                <td className="text-right">{n(r.sensibleGain.total)}</td>
                <td className="text-right">{n(r.latentGain.total)}</td>
                <td className="text-right">{n(r.coolingTotalBtuh)}</td>
                <td className="text-right">{tons(r.coolingTotalBtuh)}</td>
                <td className="text-right">{n(r.heatLoss.total)}</td>
                <td className="text-right">{hourLabel(r.peakHour)}</td>
              </tr>
            ))}
            <tr className="font-semibold">
              <td>Whole home (block)</td>
              <td className="text-right">{n(t.floorAreaFt2)}</td>
              <td className="text-right">{n(t.sensibleBtuh)}</td>
              <td className="text-right">{n(t.latentBtuh)}</td>
              <td className="text-right">{n(t.coolingBtuh)}</td>
              <td className="text-right">{t.coolingTons}</td>
              <td className="text-right">{n(t.heatingBtuh)}</td>
              <td className="text-right">{hourLabel(load.block.hour)}</td>
            </tr>
          </tbody>
        </table>
        <p className="text-xs">
          Rooms show their own peak; the whole home is the block load, the hour at which all rooms together peak (
          {hourLabel(load.block.hour)} solar time; {n(load.block.sumOfRoomPeaksSensibleBtuh)} Btu/h sensible if every
          room peaked at once). Sensible heat ratio {t.sensibleHeatRatio.toFixed(2)}.
        </p>
      </section>

      <section aria-label="Where the load comes from">
        <h2 className="font-semibold">Whole-home breakdown (Btu/h)</h2>
        <table className="w-full text-xs [&_td]:pl-1.5 [&_th]:pl-1.5">
          <thead>
            <tr className="border-b border-ink-800 text-left">
              <th>Part</th>
              <th className="text-right">Cooling gain</th>
              <th className="text-right">Heat loss</th>
            </tr>
          </thead>
          <tbody>
            {COMPONENT_KEYS.map((k) => (
              <tr key={k} className="border-b border-line">
                <td>{COMPONENT_LABELS[k]}</td>
                <td className="text-right">{n(load.sensibleGain[k] + load.latentGain[k])}</td>
                <td className="text-right">{n(load.heatLoss[k])}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <footer className="border-t border-line pt-2 text-[0.7rem] leading-snug">
        <p>
          <span className="font-semibold">A load estimate is an estimate.</span> Method: {PLAIN_METHOD}{' '}
          {withoutSourceTags(designDayLine(load))}
        </p>
      </footer>
    </article>
  );
}
