import { formatNumber, formatPercent } from '@calc';
import type { SizingView } from '../model/result-view';

/** A unit against the load it serves, in plain words, with calc's warnings beside it. */
export function SizingVerdict({ sizing }: { sizing: SizingView }) {
  const ratio = sizing.coolingRatio;
  const pct = ratio === null ? null : ratio * 100;
  const range = `${formatPercent(sizing.allowedPercent.min)}–${formatPercent(sizing.allowedPercent.max)}`;
  const words =
    pct === null
      ? 'No cooling capacity at this job’s design conditions in the catalog’s data.'
      : sizing.withinRange
        ? `Cooling ${formatPercent(pct)} of the load: within the ${range} range.`
        : pct < sizing.allowedPercent.min
          ? `Cooling ${formatPercent(pct)} of the load: below the ${range} range — too small.`
          : `Cooling ${formatPercent(pct)} of the load: above the ${range} range — oversized.`;
  const heat =
    sizing.heatingRatio === null
      ? null
      : `Heating ${formatPercent(sizing.heatingRatio * 100)} of the heat loss at the design temperature.`;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <p className={sizing.withinRange ? 'font-semibold text-ok' : 'font-semibold text-danger'}>{words}</p>
      <p className="text-muted tabular-nums">
        Load {formatNumber(sizing.coolingLoadBtuh)} Btu/h cooling, {formatNumber(sizing.heatingLoadBtuh)} Btu/h heating;
        capacity {formatNumber(sizing.coolingCapacityBtuh)} Btu/h cooling
        {sizing.heatingCapacityBtuh === null ? '' : `, ${formatNumber(sizing.heatingCapacityBtuh)} Btu/h heating`}.
      </p>
      {heat ? <p>{heat}</p> : null}
      {sizing.warnings.map((w) => (
        <p key={w} className="text-amber-deep">
          {w}
        </p>
      ))}
    </div>
  );
}
