import { roundHalfUp } from '../rounding';
import type { EquipmentType, IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { capacityAtOutdoorF, sizingRatio } from './capacity';
import { isHeatPump, type SizingPolicy } from './policy';
import { assignPorts, portLetter } from './ports';
import { explanation, type Explanation } from '../explain/explanation';
import { formatNumber, formatPercent, formatQuantity } from '../explain/format';

/** The loads a piece of equipment must meet, Btu/h. */
export interface LoadToMeet {
  readonly sensibleBtuh: number;
  readonly latentBtuh: number;
  readonly heatingBtuh: number;
}

/** One equipment-to-load match. Ratios to 3 decimals, capacities to 1 Btu/h (half-up). */
export interface SizingCheck {
  readonly coolingLoadBtuh: number;
  readonly coolingCapacityBtuh: number;
  readonly coolingRatio: number | null;
  readonly allowedPercent: { readonly min: number; readonly max: number };
  readonly withinRange: boolean;
  readonly heatingLoadBtuh: number;
  readonly heatingCapacityBtuh: number | null;
  readonly heatingRatio: number | null;
  /**
   * Which cooling limit applied: a heat pump takes its own (larger) allowance only where heating dominates
   * (heat loss above the total cooling load); elsewhere the air conditioner's limit of the same staging.
   */
  readonly limitRule: 'air-conditioner' | 'heat-pump-heating-dominated' | 'heat-pump-cooling-limit';
  /** Latent capacity at design (capacity × (1 − equipment SHR)) when the data gives an SHR, Btu/h. */
  readonly latentCapacityBtuh: number | null;
  /** The load's sensible heat ratio (sensible ÷ total), 3 decimals; null without a cooling load. */
  readonly loadSensibleHeatRatio: number | null;
  readonly warnings: readonly string[];
}

/** The air conditioner of the same staging, whose limit a heat pump takes where cooling dominates. */
const COOLING_LIMIT_OF: Record<EquipmentType, EquipmentType> = {
  'ac-single-speed': 'ac-single-speed',
  'ac-two-stage': 'ac-two-stage',
  'ac-variable-speed': 'ac-variable-speed',
  'heat-pump-single-speed': 'ac-single-speed',
  'heat-pump-two-stage': 'ac-two-stage',
  'heat-pump-variable-speed': 'ac-variable-speed',
};

/** What a sizing check reads of a unit: its name, its capacity points and its SHR. */
export interface Rated {
  readonly description: string;
  readonly cooling: IndoorUnit['cooling'];
  readonly heating?: IndoorUnit['heating'] | undefined;
  readonly sensibleHeatRatio?: number | undefined;
}

/**
 * What an indoor unit's zone is sized on. A one-to-one system (a single-zone pair, or a ducted outdoor unit with its
 * air handler: one indoor unit on an outdoor unit that takes one) delivers the capacity of the pair, which the
 * catalog carries as the outdoor unit's expanded data: an air handler's own nominal (e.g. 36k for a "24k–36k" handler)
 * is the largest system it suits, not what it delivers on a 24k heat pump. [PUB (secondary): Manual S explainers —
 * select from the maker's expanded performance data of the system at design conditions (reference §7); common
 * practice: a split system is rated as the outdoor unit with its matched indoor coil.] On a multi-zone unit each head
 * keeps its own rating (the outdoor unit's is shared among them and checked on its own).
 */
export function zoneRating({
  indoor,
  outdoor,
  indoorUnitsOnSystem,
}: {
  readonly indoor: IndoorUnit;
  readonly outdoor: OutdoorUnit | undefined;
  readonly indoorUnitsOnSystem: number;
}): { readonly unit: Rated; readonly matched: boolean } {
  if (!outdoor || outdoor.maxHeads !== 1 || indoorUnitsOnSystem !== 1) return { unit: indoor, matched: false };
  return {
    matched: true,
    unit: {
      description: `${outdoor.description} with ${indoor.description}`,
      cooling: outdoor.cooling,
      heating: outdoor.heating ?? indoor.heating,
      sensibleHeatRatio: outdoor.sensibleHeatRatio ?? indoor.sensibleHeatRatio,
    },
  };
}

/**
 * Checks equipment capacity at the design outdoor temperatures against a load, using the
 * sizing range for `equipmentType` from `policy` [MEM: Manual S limits as company policy].
 * Warnings are plain words for the estimator.
 */
export function checkSizing({
  unit,
  equipmentType,
  load,
  coolingDesignF,
  heatingDesignF,
  policy,
}: {
  readonly unit: Rated;
  readonly equipmentType: EquipmentType;
  readonly load: LoadToMeet;
  readonly coolingDesignF: number;
  readonly heatingDesignF: number;
  readonly policy: SizingPolicy;
}): SizingCheck {
  const warnings: string[] = [];
  const coolingLoad = load.sensibleBtuh + load.latentBtuh;
  // The larger heat-pump allowance only where heating dominates (heat loss > total cooling load), a stated
  // rule [MEM: ACCA Manual S 2nd ed. lets heat pumps in heating-dominated climates exceed the cooling limit].
  const heatPump = isHeatPump(equipmentType);
  const heatingDominated = load.heatingBtuh > coolingLoad;
  const limitRule = !heatPump
    ? 'air-conditioner'
    : heatingDominated
      ? 'heat-pump-heating-dominated'
      : 'heat-pump-cooling-limit';
  const range =
    policy.cooling[limitRule === 'heat-pump-cooling-limit' ? COOLING_LIMIT_OF[equipmentType] : equipmentType];
  const cool = capacityAtOutdoorF({ points: unit.cooling, outdoorF: coolingDesignF });
  if (cool.extrapolated)
    warnings.push(
      `${unit.description}: ${coolingDesignF} °F is outside the maker's cooling data; the capacity is extended from the nearest points. Ask the maker for data at this temperature.`,
    );
  const ratio = coolingLoad > 0 ? sizingRatio({ loadBtuh: coolingLoad, capacityBtuh: cool.btuh }) : null;
  const pct = ratio === null ? null : roundHalfUp(ratio * 100);
  const within = ratio !== null && ratio * 100 >= range.minPercent - 1e-9 && ratio * 100 <= range.maxPercent + 1e-9;
  if (ratio === null) warnings.push(`${unit.description}: there is no cooling load to size against.`);
  else if (!within && ratio * 100 < range.minPercent)
    warnings.push(
      `${unit.description} covers only ${pct} % of the cooling load at ${coolingDesignF} °F (allowed ${range.minPercent}–${range.maxPercent} %): choose a larger unit.`,
    );
  else if (!within)
    warnings.push(
      `${unit.description} delivers ${pct} % of the cooling load at ${coolingDesignF} °F (allowed ${range.minPercent}–${range.maxPercent} %): it is oversized and will dehumidify poorly; choose a smaller unit.`,
    );
  if (unit.sensibleHeatRatio !== undefined && cool.btuh * unit.sensibleHeatRatio < load.sensibleBtuh) {
    warnings.push(
      `${unit.description}: its sensible capacity (${roundHalfUp(cool.btuh * unit.sensibleHeatRatio)} Btu/h) is below the sensible load (${roundHalfUp(load.sensibleBtuh)} Btu/h).`,
    );
  }
  // Latent check: latent capacity = capacity × (1 − SHR) against the latent load [PUB: SHR = sensible ÷ total;
  // TRADE: the equipment's SHR at design should not exceed the load's in humid climates].
  const latentCapacity =
    unit.sensibleHeatRatio === undefined ? null : roundHalfUp(cool.btuh * (1 - unit.sensibleHeatRatio));
  const loadShr = coolingLoad > 0 ? roundHalfUp(load.sensibleBtuh / coolingLoad, 3) : null;
  if (latentCapacity !== null && latentCapacity < load.latentBtuh) {
    warnings.push(
      `${unit.description}: its latent capacity (${latentCapacity} Btu/h at SHR ${unit.sensibleHeatRatio ?? ''}) is below the latent load (${roundHalfUp(load.latentBtuh)} Btu/h, load SHR ${loadShr ?? ''}): the house may stay humid.`,
    );
  }
  if (heatPump && limitRule === 'heat-pump-cooling-limit' && ratio !== null && ratio * 100 > range.maxPercent) {
    warnings.push(
      `Cooling dominates here (heat loss ${roundHalfUp(load.heatingBtuh)} ≤ cooling ${roundHalfUp(coolingLoad)} Btu/h), so the heat pump gets the air-conditioner limit, not the larger heat-pump allowance.`,
    );
  }
  let heatingCapacity: number | null = null;
  let heatingRatio: number | null = null;
  if (unit.heating && isHeatPump(equipmentType)) {
    const heat = capacityAtOutdoorF({ points: unit.heating, outdoorF: heatingDesignF });
    heatingCapacity = roundHalfUp(heat.btuh);
    if (load.heatingBtuh > 0) {
      heatingRatio = roundHalfUp(sizingRatio({ loadBtuh: load.heatingBtuh, capacityBtuh: heat.btuh }), 3);
      if (heatingRatio * 100 < policy.heatingMinPercent) {
        warnings.push(
          `${unit.description} heats ${roundHalfUp(heatingRatio * 100)} % of the heat loss at ${heatingDesignF} °F: plan supplemental heat or a larger unit.`,
        );
      }
    }
    if (heat.extrapolated)
      warnings.push(
        `${unit.description}: ${heatingDesignF} °F is outside the maker's heating data; the capacity is extended from the nearest points. Ask the maker for data at this temperature.`,
      );
  }
  return {
    coolingLoadBtuh: coolingLoad,
    coolingCapacityBtuh: roundHalfUp(cool.btuh),
    coolingRatio: ratio === null ? null : roundHalfUp(ratio, 3),
    allowedPercent: { min: range.minPercent, max: range.maxPercent },
    withinRange: within,
    heatingLoadBtuh: load.heatingBtuh,
    heatingCapacityBtuh: heatingCapacity,
    heatingRatio,
    limitRule,
    latentCapacityBtuh: latentCapacity,
    loadSensibleHeatRatio: loadShr,
    warnings,
  };
}

/** Multi-zone combination check: head count and connected indoor nominal capacity as % of the outdoor unit's. */
export interface CombinationCheck {
  readonly heads: number;
  readonly maxHeads: number;
  /**
   * false: a one-to-one outdoor unit (one port: a single-zone pair, a ducted heat pump with its air handler),
   * rated as the matched pair — the connected-capacity range is a multi-zone check, so it is neither judged nor shown.
   */
  readonly multiZone: boolean;
  readonly connectedPercent: number;
  readonly allowedPercent: { readonly min: number; readonly max: number };
  readonly ok: boolean;
  /** The port each indoor unit sits on (0 = A), in circuit order; null without a port table or when refused. */
  readonly ports: readonly number[] | null;
  /** Why the combination is refused (too many heads, a size no port accepts, connected capacity out of range). */
  readonly refusals: readonly string[];
  readonly warnings: readonly string[];
  readonly explanation: Explanation;
}

const kBtuh = (v: number) => `${formatNumber(v / 1000, 1, { trim: true })}k`;

/**
 * Sum of connected indoor nominal capacity ÷ outdoor nominal, %, rounded half-up to 1 %; the head
 * count against the ports; each indoor size against the port table when the maker gives one. Every
 * failure refuses the combination (the design cannot be marked ready). [PUB: maker combination tables]
 */
export function checkCombination({
  outdoor,
  indoor,
}: {
  readonly outdoor: OutdoorUnit;
  readonly indoor: readonly IndoorUnit[];
}): CombinationCheck {
  const connected = indoor.reduce((s, u) => s + u.nominalBtuh, 0);
  const pct = roundHalfUp((connected / outdoor.nominalBtuh) * 100);
  const { min, max } = outdoor.connectedRatioPercent;
  const refusals: string[] = [];
  if (indoor.length > outdoor.maxHeads)
    refusals.push(
      `${outdoor.description} takes at most ${outdoor.maxHeads} indoor unit(s); ${indoor.length} are connected.`,
    );
  let ports: number[] | null = null;
  const table = outdoor.portSizesBtuh;
  if (table !== undefined && table.length > 0 && indoor.length <= table.length) {
    ports = assignPorts({ portSizesBtuh: table, indoorNominalBtuh: indoor.map((u) => u.nominalBtuh) });
    if (ports === null) {
      const accepted = [...new Set(table.flat())].sort((a, b) => a - b);
      const misfit = indoor.filter((u) => !accepted.includes(u.nominalBtuh));
      refusals.push(
        misfit.length > 0
          ? `${misfit.map((u) => `${u.description} (${kBtuh(u.nominalBtuh)})`).join(', ')}: no port of ${outdoor.description} accepts that size (ports take ${table.map((p, i) => `${portLetter(i)} ${p.map(kBtuh).join('/')}`).join('; ')}).`
          : `These indoor sizes cannot all be seated on ${outdoor.description}'s ports (${table.map((p, i) => `${portLetter(i)} ${p.map(kBtuh).join('/')}`).join('; ')}): change one of them.`,
      );
    }
  }
  // Connected capacity against the outdoor nominal is a multi-zone check (the maker's combination table); a
  // one-to-one pair is rated as the pair (compute-design's zoneRating) [common practice].
  const multiZone = outdoor.maxHeads > 1;
  if (multiZone && pct < min)
    refusals.push(
      `The connected indoor units add up to ${pct} % of ${outdoor.description}'s capacity; the maker allows ${min}–${max} %. Add or enlarge indoor units, or choose a smaller outdoor unit.`,
    );
  if (multiZone && pct > max)
    refusals.push(
      `The connected indoor units add up to ${pct} % of ${outdoor.description}'s capacity; the maker allows ${min}–${max} %. Remove or shrink indoor units, or choose a larger outdoor unit.`,
    );
  const ok = refusals.length === 0;
  const sizes = indoor.map((u) => formatQuantity(u.nominalBtuh, 'Btu/h')).join(' + ');
  const verdict = refusals.join(' ');
  // The two cases share every figure; they differ in the ports shown and in the explanation's words.
  const shown = multiZone
    ? explanation({
        key: 'combination',
        label: `Indoor units on ${outdoor.description}`,
        value: pct,
        unit: '%',
        valueText: formatPercent(pct),
        text: `${indoor.length} of ${outdoor.maxHeads} port(s) used${ports ? ` (${ports.map(portLetter).join(', ')})` : ''}; ${sizes || '0 Btu/h'} = ${formatQuantity(connected, 'Btu/h')} ÷ ${formatQuantity(outdoor.nominalBtuh, 'Btu/h')} nominal = ${formatPercent(pct)}`,
        verdict: ok ? `Within the maker's ${min}–${max} % and its ports.` : verdict,
        status: ok ? 'ok' : 'blocker',
        source: "The maker's combination table",
      })
    : explanation({
        key: 'combination',
        label: `Indoor unit on ${outdoor.description}`,
        value: indoor.length,
        unit: '',
        valueText: `${indoor.length} of 1`,
        text: `${sizes || 'No indoor unit'} on a one-to-one outdoor unit: the pair is rated together (the sizing above), so the connected-capacity range of a multi-zone unit does not apply.`,
        verdict: ok ? 'One indoor unit, as the pair is made.' : verdict,
        status: ok ? 'ok' : 'blocker',
        source: "The maker's matched-pair rating",
      });
  return {
    heads: indoor.length,
    maxHeads: outdoor.maxHeads,
    multiZone,
    connectedPercent: pct,
    allowedPercent: { min, max },
    ok,
    ports: multiZone ? ports : null,
    refusals,
    warnings: refusals,
    explanation: shown,
  };
}
