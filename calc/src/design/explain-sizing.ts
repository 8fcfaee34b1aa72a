import { explanation, type Explanation } from '../explain/explanation';
import { formatNumber, formatPercent, formatQuantity } from '../explain/format';
import { roundHalfUp } from '../rounding';
import type { CapacityPoint, EquipmentType } from '../schemas/equipment';
import { capacityAtOutdoorF, type CapacityAt } from '../sizing/capacity';
import type { SizingCheck } from '../sizing/match';
import { BTUH_PER_W } from '../units';

const EQUIPMENT_WORDS: Record<EquipmentType, string> = {
  'ac-single-speed': 'a single-speed air conditioner',
  'ac-two-stage': 'a two-stage air conditioner',
  'ac-variable-speed': 'a variable-speed air conditioner',
  'heat-pump-single-speed': 'a single-speed heat pump',
  'heat-pump-two-stage': 'a two-stage heat pump',
  'heat-pump-variable-speed': 'a variable-speed heat pump',
};

const btuh = (v: number) => formatQuantity(roundHalfUp(v), 'Btu/h');
const degF = (v: number) => `${formatNumber(v, 1, { trim: true })} °F`;

/** "at 95 °F (between the 82 and 95 °F ratings)" / "(outside the maker's data: extended from …)". */
export function capacityWords(c: CapacityAt, atF: number): string {
  const from = c.fromF ?? [];
  if (c.method === 'held')
    return `at ${degF(atF)} (outside the maker's data: the only rating, at ${degF(from[0] ?? atF)}, held)`;
  if (c.extrapolated)
    return `at ${degF(atF)} (outside the maker's data: extended from the ${from.map((f) => formatNumber(f, 1, { trim: true })).join(' and ')} °F ratings)`;
  if (from.length === 1) return `at ${degF(atF)} (the maker's rating)`;
  return `at ${degF(atF)} (between the ${from.map((f) => formatNumber(f, 1, { trim: true })).join(' and ')} °F ratings)`;
}

/**
 * Why a unit's size is what it is: cooling capacity at design against the load and the allowed
 * range in plain words ("cooling 112 % of the load: within the 90–115 % range …"), the latent check
 * and the heating coverage at the design temperature. `keyPrefix` keeps units apart ("zone:z1:").
 */
export function explainSizing({
  keyPrefix,
  who,
  sizing,
  cooling,
  heating,
  equipmentType,
  coolingDesignF,
  heatingDesignF,
  sensibleHeatRatio,
  sensibleLoadBtuh,
  latentLoadBtuh,
  ratedAs,
  backupHeat,
}: {
  /** The system's heat kit: a shortfall at the design temperature it covers is said to be covered. */
  readonly backupHeat?: { readonly description: string; readonly kw: number } | undefined;
  /** A one-to-one system's pair ("heat pump with air handler"), when the zone is sized on the pair's rating. */
  readonly ratedAs?: string | undefined;
  readonly keyPrefix: string;
  readonly who: string;
  readonly sizing: SizingCheck;
  readonly cooling: readonly CapacityPoint[];
  readonly heating?: readonly CapacityPoint[] | undefined;
  readonly equipmentType: EquipmentType;
  readonly coolingDesignF: number;
  readonly heatingDesignF: number;
  readonly sensibleHeatRatio?: number | undefined;
  readonly sensibleLoadBtuh: number;
  readonly latentLoadBtuh: number;
}): Explanation[] {
  const out: Explanation[] = [];
  const cool = capacityAtOutdoorF({ points: cooling, outdoorF: coolingDesignF });
  out.push(
    explanation({
      key: `${keyPrefix}cooling-capacity`,
      label: `Cooling capacity, ${who}`,
      value: sizing.coolingCapacityBtuh,
      unit: 'Btu/h',
      valueText: btuh(sizing.coolingCapacityBtuh),
      text: `${btuh(cool.btuh)} ${capacityWords(cool, coolingDesignF)}${ratedAs ? `; the matched system's rating (${ratedAs}), which is what the pair delivers` : ''}`,
      status: cool.extrapolated ? 'warning' : 'ok',
      verdict: cool.extrapolated
        ? "Outside the maker's data: ask the maker for a rating at this temperature."
        : undefined,
      source: ratedAs
        ? "The maker's expanded capacity data of the matched system, interpolated linearly"
        : "The maker's expanded capacity data, interpolated linearly",
    }),
    explanation({
      key: `${keyPrefix}cooling-load`,
      label: `Cooling load, ${who}`,
      value: sizing.coolingLoadBtuh,
      unit: 'Btu/h',
      valueText: btuh(sizing.coolingLoadBtuh),
      text: `${btuh(sensibleLoadBtuh)} sensible + ${btuh(latentLoadBtuh)} latent = ${btuh(sizing.coolingLoadBtuh)} at the rooms' joint peak hour`,
      source: 'Coincident load of the rooms served (loads, hour by hour)',
    }),
  );
  const range = `${formatPercent(sizing.allowedPercent.min)}–${formatPercent(sizing.allowedPercent.max)}`.replace(
    ' %–',
    '–',
  );
  const climate =
    sizing.limitRule === 'heat-pump-heating-dominated'
      ? 'a heating-dominated climate (heat loss above the cooling load), where a heat pump may be larger'
      : sizing.limitRule === 'heat-pump-cooling-limit'
        ? 'a cooling-dominated climate, so the heat pump takes the air conditioner’s limit'
        : `${EQUIPMENT_WORDS[equipmentType]}`;
  if (sizing.coolingRatio === null) {
    out.push(
      explanation({
        key: `${keyPrefix}cooling-ratio`,
        label: `Sizing, ${who}`,
        value: 0,
        unit: '%',
        valueText: 'no cooling load',
        text: 'There is no cooling load to size against.',
        status: 'warning',
      }),
    );
  } else {
    const pct = sizing.coolingRatio * 100;
    const below = pct < sizing.allowedPercent.min;
    const verdict = sizing.withinRange
      ? `cooling ${formatPercent(pct)} of the load: within the ${range} range for ${climate}`
      : below
        ? `cooling ${formatPercent(pct)} of the load: below the ${range} range for ${climate}; it will not keep up on the hottest days — choose a larger unit`
        : `cooling ${formatPercent(pct)} of the load: above the ${range} range for ${climate}; it will cycle and leave the air damp — choose a smaller unit`;
    out.push(
      explanation({
        key: `${keyPrefix}cooling-ratio`,
        label: `Sizing, ${who}`,
        value: roundHalfUp(pct, 1),
        unit: '%',
        valueText: formatPercent(pct),
        text: `${btuh(sizing.coolingCapacityBtuh)} ÷ ${btuh(sizing.coolingLoadBtuh)} = ${formatPercent(pct)}`,
        verdict,
        status: sizing.withinRange ? 'ok' : 'warning',
        source: 'Company sizing policy (ACCA Manual S limits, from memory)',
      }),
    );
  }
  if (sizing.latentCapacityBtuh !== null && sensibleHeatRatio !== undefined) {
    const ok = sizing.latentCapacityBtuh >= latentLoadBtuh;
    out.push(
      explanation({
        key: `${keyPrefix}latent`,
        label: `Moisture removal, ${who}`,
        value: sizing.latentCapacityBtuh,
        unit: 'Btu/h',
        valueText: btuh(sizing.latentCapacityBtuh),
        text: `${btuh(sizing.coolingCapacityBtuh)} × (1 − ${formatNumber(sensibleHeatRatio, 2)} SHR) = ${btuh(sizing.latentCapacityBtuh)} against a latent load of ${btuh(latentLoadBtuh)}`,
        verdict: ok
          ? 'Enough to remove the moisture at design.'
          : 'Short of the latent load: the house may stay humid.',
        status: ok ? 'ok' : 'warning',
        source: 'Sensible heat ratio = sensible ÷ total',
      }),
    );
  }
  if (heating && heating.length > 0 && sizing.heatingCapacityBtuh !== null) {
    const heat = capacityAtOutdoorF({ points: heating, outdoorF: heatingDesignF });
    const loss = sizing.heatingLoadBtuh;
    const pct = loss > 0 ? (heat.btuh / loss) * 100 : null;
    // Resistance heat: 1 kW = 3,412.142 Btu/h [PUB: the IT Btu definition].
    const backupBtuh = (backupHeat?.kw ?? 0) * 3412.142;
    const covered = backupHeat !== undefined && heat.btuh + backupBtuh >= loss;
    out.push(
      explanation({
        key: `${keyPrefix}heating-coverage`,
        label: `Heating at the design temperature, ${who}`,
        value: pct === null ? 0 : roundHalfUp(pct, 1),
        unit: '%',
        valueText: pct === null ? 'no heat loss' : formatPercent(pct),
        text:
          pct === null
            ? `${btuh(heat.btuh)} ${capacityWords(heat, heatingDesignF)}; no heat loss`
            : `${btuh(heat.btuh)} ${capacityWords(heat, heatingDesignF)} ÷ ${btuh(loss)} heat loss = ${formatPercent(pct)}`,
        verdict:
          pct === null
            ? undefined
            : pct >= 100
              ? 'Covers the heat loss at the design temperature.'
              : covered
                ? `Short by ${btuh(loss - heat.btuh)} at ${degF(heatingDesignF)}, covered by ${backupHeat?.description ?? 'the heat kit'} (${formatNumber(backupHeat?.kw ?? 0, 1, { trim: true })} kW = ${btuh(backupBtuh)}).`
                : `Short by ${btuh(loss - heat.btuh)} at ${degF(heatingDesignF)}: plan backup heat or a larger unit.`,
        status: pct !== null && pct < 100 && !covered ? 'warning' : heat.extrapolated ? 'warning' : 'ok',
        source: "The maker's heating capacity data",
      }),
    );
  }
  return out;
}

export interface HeatingBalance {
  /** Outdoor temperature where the heat pump's capacity meets the heat loss, °F (1 decimal); null when it never does above the search floor. */
  readonly balancePointF: number | null;
  /** Heat the heat pump cannot give at the design temperature, Btu/h (0 when it covers it). */
  readonly shortfallBtuh: number;
  /** Backup heat to cover the shortfall, kW, rounded up to 0.1 kW. */
  readonly backupKw: number;
  readonly explanations: readonly Explanation[];
}

/**
 * Balance point and backup heat. The heat loss is taken as a straight line from the design heat
 * loss at the design temperature to zero at the indoor set point, HL(T) = HL × (Ti − T)/(Ti − Td)
 * [PUB: the degree-day / bin method's linear building load line]; the balance point is where the
 * capacity curve (the maker's points, extended outside them) crosses it, found by bisection to
 * 0.01 °F between 60 °F below the design temperature and the set point. Backup kW = shortfall ÷
 * 3,412.14 Btu/h per kW, rounded up to 0.1 kW. A heat kit from the catalog, when chosen, is checked
 * against it.
 */
export function heatingBalance({
  keyPrefix,
  who,
  heating,
  heatLossBtuh,
  heatingDesignF,
  indoorF,
  heatKit,
}: {
  readonly keyPrefix: string;
  readonly who: string;
  readonly heating: readonly CapacityPoint[];
  readonly heatLossBtuh: number;
  readonly heatingDesignF: number;
  readonly indoorF: number;
  readonly heatKit?: { readonly description: string; readonly kw: number } | undefined;
}): HeatingBalance {
  const span = indoorF - heatingDesignF;
  const loss = (t: number) => (span <= 0 ? 0 : (heatLossBtuh * (indoorF - t)) / span);
  const cap = (t: number) => capacityAtOutdoorF({ points: heating, outdoorF: t }).btuh;
  const f = (t: number) => cap(t) - loss(t);
  let lo = heatingDesignF - 60;
  let hi = indoorF;
  let balance: number | null = null;
  if (heatLossBtuh > 0 && span > 0 && f(lo) < 0 && f(hi) >= 0) {
    for (let i = 0; i < 60 && hi - lo > 0.005; i += 1) {
      const mid = (lo + hi) / 2;
      if (f(mid) >= 0) hi = mid;
      else lo = mid;
    }
    balance = roundHalfUp(hi, 1);
  }
  const atDesign = cap(heatingDesignF);
  const shortfall = Math.max(0, roundHalfUp(heatLossBtuh - atDesign));
  const backupKw = shortfall === 0 ? 0 : Math.ceil(shortfall / (BTUH_PER_W * 1000) / 0.1 - 1e-9) * 0.1;
  const kw = roundHalfUp(backupKw, 1);
  const out: Explanation[] = [
    explanation({
      key: `${keyPrefix}balance-point`,
      label: `Balance point, ${who}`,
      value: balance ?? 0,
      unit: '°F',
      valueText: balance === null ? `below ${degF(heatingDesignF - 60)}` : degF(balance),
      text:
        balance === null
          ? `The capacity stays above the heat loss down to ${degF(heatingDesignF - 60)}`
          : `Capacity meets the heat loss line (${btuh(heatLossBtuh)} at ${degF(heatingDesignF)} falling to 0 at ${degF(indoorF)}) at ${degF(balance)}`,
      verdict:
        balance === null || balance <= heatingDesignF
          ? 'Below the design temperature: the heat pump carries the house on its own at design.'
          : `Above the design temperature: below ${degF(balance)} backup heat is needed.`,
      status: balance !== null && balance > heatingDesignF ? 'note' : 'ok',
      source: 'Linear building load line (bin method) against the maker’s heating data',
    }),
  ];
  const kitBtuh = heatKit ? heatKit.kw * BTUH_PER_W * 1000 : null;
  const kitCovers = kitBtuh === null ? null : kitBtuh >= shortfall;
  out.push(
    explanation({
      key: `${keyPrefix}backup-heat`,
      label: `Backup heat, ${who}`,
      value: kw,
      unit: 'kW',
      valueText: formatQuantity(kw, 'kW', 1),
      text:
        shortfall === 0
          ? `${btuh(atDesign)} at ${degF(heatingDesignF)} ≥ ${btuh(heatLossBtuh)} heat loss: no backup needed at design = 0 kW`
          : `${btuh(heatLossBtuh)} − ${btuh(atDesign)} at ${degF(heatingDesignF)} = ${btuh(shortfall)} ÷ 3,412.14 Btu/h per kW = ${formatQuantity(kw, 'kW', 1)}${heatKit ? `; ${heatKit.description}: ${formatQuantity(heatKit.kw, 'kW', 1)} = ${btuh(kitBtuh ?? 0)}` : ''}`,
      verdict:
        shortfall === 0
          ? undefined
          : heatKit === undefined
            ? `Choose a heat kit of at least ${formatQuantity(kw, 'kW', 1)}, or a larger heat pump.`
            : kitCovers
              ? 'The chosen heat kit covers the shortfall.'
              : `The chosen heat kit is too small: at least ${formatQuantity(kw, 'kW', 1)} is needed.`,
      status: shortfall === 0 || kitCovers === true ? 'ok' : 'warning',
      source: '1 kW = 3,412.14 Btu/h',
    }),
  );
  return { balancePointF: balance, shortfallBtuh: shortfall, backupKw: kw, explanations: out };
}
