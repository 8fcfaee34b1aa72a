import type { RoomLoad } from '@calc';
import { tons } from '../model/tons';
import { groupedNumber } from '../../../lib/grouped-number';

const n = groupedNumber;

/** The headline numbers of one room. */
export function LoadFigures({ load }: { load: RoomLoad }) {
  const rows: [string, string][] = [
    ['Sensible gain', `${n(load.sensibleGain.total)} Btu/h`],
    ['Latent gain', `${n(load.latentGain.total)} Btu/h`],
    ['Total cooling', `${n(load.coolingTotalBtuh)} Btu/h (${tons(load.coolingTotalBtuh)} tons)`],
    ['Heat loss', `${n(load.heatLoss.total)} Btu/h`],
    ['Peaks at', `${String(load.peakHour).padStart(2, '0')}:00 solar time`],
    [
      'At the home’s peak',
      `${n(load.atBlock.sensibleBtuh)} Btu/h sensible (${String(load.atBlock.hour).padStart(2, '0')}:00)`,
    ],
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-4 lg:grid-cols-2">
      {rows.map(([label, value]) => (
        <div key={label}>
          <dt className="text-sm text-muted">{label}</dt>
          <dd
            className="text-lg font-semibold text-ink-900"
            data-testid={`load-${label.toLowerCase().replace(/\s+/g, '-')}`}
          >
            {value}
          </dd>
        </div>
      ))}
    </dl>
  );
}
