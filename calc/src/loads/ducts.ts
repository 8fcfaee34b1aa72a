import { LATENT_CONSTANT, SENSIBLE_CONSTANT } from '../air';
import { ADJACENT_SPACE } from '../construction-defaults';
import { num } from '../errors';
import { parseOrThrow } from '../parse';
import { roundHalfUp } from '../rounding';
import { designConditionsSchema, type DesignConditionsInput } from '../schemas/design-conditions';
import {
  ductSystemSchema,
  type DuctLeakage,
  type DuctLocation,
  type DuctSystem,
  type DuctSystemInput,
} from '../schemas/ducts';
import { BTUH_PER_TON } from '../units';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { designDayContext, HOURS, type DesignDayContext } from './design-day-context';

/**
 * Duct gains and losses by the design delivery-effectiveness method of ANSI/ASHRAE Standard 152
 * ("Method of Test for Determining the Design and Seasonal Efficiencies of Residential Thermal
 * Distribution Systems"), design-condition form:
 *
 *   DE = a_s·B_s − a_s·B_s·(1 − a_r·B_r)·ΔT_r/ΔT_e − a_s·(1 − B_s)·ΔT_s/ΔT_e
 *
 * a = 1 − leakage fraction (supply s, return r), B = exp(−A / (1.08·Q·R)) the conduction fraction
 * of a duct of surface A and R at blower airflow Q, ΔT_s,r = indoor − duct surroundings, ΔT_e the
 * temperature change across the equipment. The equation is the steady energy balance of the air
 * loop (the return picks up heat by conduction and draws leakage air from the surroundings; the
 * supply loses heat by conduction along its whole length and then part of the air leaks out),
 * which the tests check by marching the air through each duct in small steps.
 * [The equation is re-derived here from the energy balance (the tests march the air through each duct);
 * it is the design-condition form of ANSI/ASHRAE Standard 152 as recalled. No clause of the standard
 * is cited: its text was not found in a public copy.]
 *
 * Since ΔT_e = E/(1.08·Q) for an equipment output E, the output that delivers a load L is
 *   E = (L + 1.08·Q·[a_s·B_s·(1 − a_r·B_r)·D_r + a_s·(1 − B_s)·D_s]) / (a_s·B_s)
 * with D = how much worse the surroundings are than indoors (hotter in cooling, colder in heating),
 * and the duct load is E − L. Return leakage from a space open to outdoor air brings outdoor
 * moisture, C_l·f_r·Q·Δgr, which the equipment removes before the supply leaks; so the latent
 * output is L/a_s + C_l·f_r·Q·Δgr. Supply leakage that makes the house draw in more outdoor air is not counted (stated).
 */
export const DUCT_METHOD_SOURCE =
  'Design delivery effectiveness after ANSI/ASHRAE Standard 152: the steady energy balance of the duct loop, re-derived and checked by marching the air through each duct';

/**
 * Default duct surface areas outside the conditioned space, as fractions of the floor area served: supply
 * 0.27·F_out, return b_r·F_out with b_r = 0.05 per return register (at most 0.25), F_out = 1 for a one-storey
 * house and 0.75 for two or more storeys (the rest of the ducts, 1 − F_out, run inside the conditioned space and
 * lose nothing). [PUB: ANSI/ASHRAE Standard 152-2004 default duct surface areas, as the NREL OpenStudio-HPXML
 * documentation ("HPXML Air Distribution", docs/source/hpxml_to_openstudio.rst) states them; one return register
 * per conditioned storey when the number is not known is that documentation's default.] Enter the measured
 * areas where known.
 */
export const DUCT_AREA_DEFAULT = {
  supplyPerFt2: 0.27,
  returnPerFt2PerRegister: 0.05,
  returnMaxPerFt2: 0.25,
  outsideFractionMultiStorey: 0.75,
} as const;

/** The default supply and return duct surface areas outside the conditioned space, ft² (see DUCT_AREA_DEFAULT). */
export function defaultDuctAreasFt2(floorAreaFt2: number, storeys: number): { supply: number; return: number } {
  const n = Math.max(1, Math.round(storeys));
  const fOut = n <= 1 ? 1 : DUCT_AREA_DEFAULT.outsideFractionMultiStorey;
  const br = Math.min(DUCT_AREA_DEFAULT.returnMaxPerFt2, DUCT_AREA_DEFAULT.returnPerFt2PerRegister * n);
  return { supply: DUCT_AREA_DEFAULT.supplyPerFt2 * fOut * floorAreaFt2, return: br * fOut * floorAreaFt2 };
}

/**
 * The duct wall's effective R, h·ft²·°F/Btu per ft² of duct surface: what a round flex duct really gives, which is
 * less than its nominal insulation R plus films. The insulation is a cylinder around the duct, so its R on the
 * duct's inner surface is k·(d/2)·ln(1 + 2t/d) (t = R_nominal / k thick, k = R-2.8 per inch, fibreglass); the
 * inside film of a round duct is 0.3429·d^0.1974 and the outside film 0.667 scaled by d/(d + 2t) to the inner
 * surface; an uninsulated duct is. Supply ducts are taken at 6 in and return ducts at 14 in diameter.
 * [PUB: Palmiter and Kruse (2006), "True R-Values of Round Residential Ductwork", as NREL's OpenStudio-HPXML
 * implements it for ANSI/RESNET/ICC 301 (HPXMLtoOpenStudio/resources/defaults.rb, get_duct_effective_r_value,
 * with these constants), read 5 Dec 2026.] [OWN: every duct outside the conditioned space is taken as round flex
 * duct — the same source gives a rectangular duct 0.333 + R + 0.667, and we do not ask the duct's shape.]
 * Nominal R-6 gives supply and return (nominal + the old still-air film would be 6.68).
 */
export const DUCT_EFFECTIVE_R = {
  uninsulatedR: 1.7,
  insulationRPerInch: 2.8,
  insideFilmCoefficient: 0.3429,
  insideFilmExponent: 0.1974,
  outsideFilmR: 0.667,
  supplyDiameterIn: 6,
  returnDiameterIn: 14,
} as const;

/** Effective R of a round insulated duct of `diameterIn` with nominal insulation `nominalR` (see DUCT_EFFECTIVE_R), 2 decimals. */
export function ductEffectiveR(nominalR: number, diameterIn: number): number {
  const k = DUCT_EFFECTIVE_R;
  if (nominalR <= 0) return k.uninsulatedR;
  const d = diameterIn;
  const t = nominalR / k.insulationRPerInch;
  const insulation = k.insulationRPerInch * (d / 2) * Math.log(1 + (2 * t) / d);
  const inside = k.insideFilmCoefficient * d ** k.insideFilmExponent;
  const outside = k.outsideFilmR * (d / (d + 2 * t));
  return roundHalfUp(inside + insulation + outside, 2);
}

/** Leakage to outside the conditioned space, fraction of the blower airflow, supply and return. [TRADE: common practice, replace with a duct-leakage test where one exists] */
export const DUCT_LEAKAGE: Readonly<
  Record<DuctLeakage, { readonly supply: number; readonly return: number; readonly label: string }>
> = {
  sealed: { supply: 0.04, return: 0.04, label: 'Sealed and tested (about 4 % each side)' },
  typical: { supply: 0.1, return: 0.1, label: 'Typical (about 10 % each side)' },
  leaky: { supply: 0.2, return: 0.2, label: 'Leaky (about 20 % each side)' },
};

/** Default blower airflow: 400 cfm per ton of the cooling load served (of the heat loss when there is no cooling load). [TRADE: trade-facts §7, 400 CFM/ton] */
export const DUCT_CFM_PER_TON = 400;

/**
 * Duct surroundings as a fraction of the way from indoor to outdoor (heating, cooling): the same
 * buffer-space fractions the envelope uses for floors over these spaces [TRADE, ADJACENT_SPACE];
 * an attic is at outdoor in heating and at the hour's attic air temperature in cooling [OWN attic model].
 */
function surroundings(location: DuctLocation): { heating: number; cooling: number } | 'attic' | null {
  switch (location) {
    case 'conditioned':
      return null;
    case 'attic':
      return 'attic';
    case 'crawlspace':
      return ADJACENT_SPACE.crawlspaceVented.value;
    case 'garage':
      return ADJACENT_SPACE.garage.value;
    case 'basement':
      return ADJACENT_SPACE.basement.value;
  }
}

/** Whether a space's air is outdoor air for moisture (return leakage from it brings outdoor grains). [OWN: stated rule] */
const OUTDOOR_MOISTURE: Readonly<Record<DuctLocation, boolean>> = {
  conditioned: false,
  attic: true,
  crawlspace: true,
  garage: true,
  basement: false,
};

/** What the ducted system serves: the coincident load of its rooms (see `coincidentLoad`) and their floor area. */
export interface DuctServed {
  /** Hour (1–24, solar time) of the served rooms' coincident sensible peak. */
  readonly hour: number;
  readonly sensibleBtuh: number;
  readonly latentBtuh: number;
  readonly heatingBtuh: number;
  readonly floorAreaFt2: number;
  /** Above-grade storeys the served rooms are on (1 when not given): sets the default duct areas. */
  readonly storeys?: number;
}

/** Duct gains and losses, Btu/h (rounded half-up to 1 Btu/h), with the inputs used. */
export interface DuctLoad {
  readonly location: DuctLocation;
  readonly airflowCfm: number;
  readonly supplyAreaFt2: number;
  readonly returnAreaFt2: number;
  readonly insulationR: number;
  /** The duct wall's effective R on the supply and return sides (DUCT_EFFECTIVE_R), h·ft²·°F/Btu. */
  readonly supplyEffectiveR: number;
  readonly returnEffectiveR: number;
  readonly supplyLeakageFraction: number;
  readonly returnLeakageFraction: number;
  /** Conduction fractions B_s, B_r (4 decimals). */
  readonly supplyConductionFraction: number;
  readonly returnConductionFraction: number;
  readonly cooling: {
    readonly hour: number;
    readonly surroundingsF: number;
    readonly sensibleBtuh: number;
    readonly latentBtuh: number;
    /** Delivered ÷ equipment sensible output (3 decimals); 1 with no load. */
    readonly deliveryEffectiveness: number;
  };
  readonly heating: {
    readonly surroundingsF: number;
    readonly btuh: number;
    readonly deliveryEffectiveness: number;
  };
  readonly source: string;
}

/** Equipment output that delivers `load` through the loop (see the module note). */
function equipmentOutput(
  load: number,
  cq: number,
  as: number,
  bs: number,
  ar: number,
  br: number,
  dSupply: number,
  dReturn: number,
): number {
  return (load + cq * (as * bs * (1 - ar * br) * dReturn + as * (1 - bs) * dSupply)) / (as * bs);
}

/** Duct loads from parsed inputs (engine path). `served.hour` picks the cooling hour's outdoor and attic air. */
export function ductLoadFromParsed(
  ducts: DuctSystem,
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  served: DuctServed,
): DuctLoad {
  const index = Math.min(HOURS - 1, Math.max(0, Math.round(served.hour) - 1));
  const leak = DUCT_LEAKAGE[ducts.leakage];
  const fs = ducts.supplyLeakageFraction ?? leak.supply;
  const fr = ducts.returnLeakageFraction ?? leak.return;
  const defaults = defaultDuctAreasFt2(served.floorAreaFt2, served.storeys ?? 1);
  const as = ducts.supplyAreaFt2 ?? defaults.supply;
  const ar = ducts.returnAreaFt2 ?? defaults.return;
  const coolingTotal = Math.max(0, served.sensibleBtuh) + Math.max(0, served.latentBtuh);
  const q =
    ducts.airflowCfm ??
    (DUCT_CFM_PER_TON * (coolingTotal > 0 ? coolingTotal : Math.max(0, served.heatingBtuh))) / BTUH_PER_TON;
  const cq = SENSIBLE_CONSTANT * psy.altitudeFactor * q;
  const rs = ductEffectiveR(ducts.insulationR, DUCT_EFFECTIVE_R.supplyDiameterIn);
  const rr = ductEffectiveR(ducts.insulationR, DUCT_EFFECTIVE_R.returnDiameterIn);
  const bs = cq > 0 ? Math.exp(-as / (cq * rs)) : 0;
  const br = cq > 0 ? Math.exp(-ar / (cq * rr)) : 0;
  const where = surroundings(ducts.location);
  const indoorC = psy.indoorCoolingF;
  const outdoorC = ctx.outdoorF[index] ?? psy.outdoorCoolingF;
  const coolF =
    where === null
      ? indoorC
      : where === 'attic'
        ? indoorC + (ctx.atticDt(ducts.roofColor ?? 'medium', ducts.radiantBarrier ?? false)[index] ?? 0)
        : indoorC + where.cooling * (outdoorC - indoorC);
  const heatF =
    where === null
      ? psy.indoorHeatingF
      : where === 'attic'
        ? psy.outdoorHeatingF
        : psy.indoorHeatingF - where.heating * psy.heatingDeltaTF;
  const active = where !== null && cq > 0;
  const as1 = 1 - fs;
  const ar1 = 1 - fr;
  const sens = Math.max(0, served.sensibleBtuh);
  const heat = Math.max(0, served.heatingBtuh);
  const lat = Math.max(0, served.latentBtuh);
  const coolEq = active ? equipmentOutput(sens, cq, as1, bs, ar1, br, coolF - indoorC, coolF - indoorC) : sens;
  const heatEq = active
    ? equipmentOutput(heat, cq, as1, bs, ar1, br, psy.indoorHeatingF - heatF, psy.indoorHeatingF - heatF)
    : heat;
  const returnMoisture =
    active && OUTDOOR_MOISTURE[ducts.location] ? LATENT_CONSTANT * psy.altitudeFactor * fr * q * psy.deltaGrains : 0;
  const latEq = active ? lat / as1 + returnMoisture : lat;
  const coolDuct = Math.max(0, coolEq - sens);
  const heatDuct = Math.max(0, heatEq - heat);
  return {
    location: ducts.location,
    airflowCfm: roundHalfUp(q, 0),
    supplyAreaFt2: roundHalfUp(as, 1),
    returnAreaFt2: roundHalfUp(ar, 1),
    insulationR: ducts.insulationR,
    supplyEffectiveR: rs,
    returnEffectiveR: rr,
    supplyLeakageFraction: fs,
    returnLeakageFraction: fr,
    supplyConductionFraction: roundHalfUp(bs, 4),
    returnConductionFraction: roundHalfUp(br, 4),
    cooling: {
      hour: index + 1,
      surroundingsF: roundHalfUp(coolF, 1),
      sensibleBtuh: roundHalfUp(coolDuct),
      latentBtuh: roundHalfUp(Math.max(0, latEq - lat)),
      deliveryEffectiveness: sens > 0 && coolEq > 0 ? roundHalfUp(sens / coolEq, 3) : 1,
    },
    heating: {
      surroundingsF: roundHalfUp(heatF, 1),
      btuh: roundHalfUp(heatDuct),
      deliveryEffectiveness: heat > 0 && heatEq > 0 ? roundHalfUp(heat / heatEq, 3) : 1,
    },
    source: DUCT_METHOD_SOURCE,
  };
}

/**
 * Duct gains (cooling sensible and latent) and losses (heating), Btu/h, for a ducted system
 * serving `served` — give it the coincident load of the rooms on the system (`coincidentLoad`)
 * and their floor area. Validates `ducts` and `designConditions` (CalcError INVALID_INPUT).
 * Method and sources: `DUCT_METHOD_SOURCE`; each figure rounded half-up to 1 Btu/h.
 */
export function ductLoad({
  ducts,
  designConditions,
  served,
}: {
  readonly ducts: DuctSystemInput;
  readonly designConditions: DesignConditionsInput;
  readonly served: DuctServed;
}): DuctLoad {
  const d = parseOrThrow(ductSystemSchema, ducts);
  const c = parseOrThrow(designConditionsSchema, designConditions);
  num(served.hour, 'positive');
  if (served.storeys !== undefined) num(served.storeys, 'positive');
  num(served.sensibleBtuh);
  num(served.latentBtuh);
  num(served.heatingBtuh);
  num(served.floorAreaFt2, 'nonNegative');
  return ductLoadFromParsed(d, designPsychrometrics(c), designDayContext(c), served);
}
