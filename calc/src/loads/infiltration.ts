import { INFILTRATION_TIGHTNESS } from '../construction-defaults';
import { num } from '../errors';
import type { Tightness } from '../schemas/home';

/*
 * Design air leakage for both seasons from one leakage figure, the effective leakage area A_L (at 4 Pa,
 * discharge coefficient 1), by the residential chapter's procedure: Q = A_L × IDF, the infiltration driving
 * force IDF = (I0 + I1·H·|Δt|)/1000 L/(s·cm²) with H the house's stack height, m, and Δt the indoor–outdoor
 * design difference, K — Barnaby and Spitler's fit to the enhanced (AIM-2) stack-and-wind model of ch. 16
 * at the chapter's design winds (3.4 m/s cooling, 6.7 m/s heating), for typical suburban shelter and any
 * elevation. [PUB: ASHRAE Handbook—Fundamentals 2021 (SI) ch. 17 eqs. (8) and (10) and its Table 5 of IDF
 * values, which tests/calc/infiltration.test.ts checks; the flue term of eq. (10) is left out — the walk-through
 * records no flue, so a house with an open flue leaks more than this says. Read in a copy of the 2021 SI chapter
 * in a public repository.]
 * The chapter's fit, not the basic (Sherman–Grimsrud) model: for the two-storey house of ch. 16's Examples 2
 * and 5 (A_L 500 cm², 39 K, 6.7 m/s) the fit gives 0.060 m³/s, the enhanced model's worked example 0.059 and
 * the basic model's 0.074 (checked in the same test file).
 */

/**
 * The design wind speed, m/s, and the IDF coefficients of each season; i2 scales the flue's share of the leakage
 * area. [PUB: ch. 17 eq. (10) coefficients]
 */
export const IDF_COEFFICIENTS = {
  cooling: { windMs: 3.4, i0: 25, i1: 0.38, i2: 0.12 },
  heating: { windMs: 6.7, i0: 51, i1: 0.35, i2: 0.23 },
} as const;
export type LeakageSeason = keyof typeof IDF_COEFFICIENTS;

/**
 * Unit leakage area A_ul, cm² of effective leakage area per m² of exposed surface, by tightness — the walk-through's
 * five words are the table's five rows (very tight = "construction supervised by air-sealing specialist", tight =
 * "carefully sealed construction by knowledgeable builder", average = "typical current production housing", leaky
 * = "typical pre-1970 houses", very leaky = "old houses in original condition"). A_L = A_es × A_ul, A_es the
 * above-grade surface between outdoors (or attic) and the conditioned space. [PUB: ch. 17 eq. (9) and Table 3
 * "Unit Leakage Areas" (2021 SI); 0.01/0.02/0.04/0.08/0.15 in²/ft² in the IP edition]
 */
export const UNIT_LEAKAGE_AREA_CM2_PER_M2: Readonly<Record<Tightness, number>> = {
  'very-tight': INFILTRATION_TIGHTNESS['very-tight'].value,
  tight: INFILTRATION_TIGHTNESS.tight.value,
  average: INFILTRATION_TIGHTNESS.average.value,
  leaky: INFILTRATION_TIGHTNESS.leaky.value,
  'very-leaky': INFILTRATION_TIGHTNESS['very-leaky'].value,
};

/** Air density of the leakage-area definition, kg/m³ (ch. 16's worked examples' c ↔ A_L pairs use it). */
export const LEAKAGE_AIR_DENSITY = 1.2;
/** Pressure exponent n when a blower-door test gives only CFM50: "a typical value for n is about 0.65" [PUB: ch. 16]. */
export const DEFAULT_PRESSURE_EXPONENT = 0.65;

const M3S_PER_CFM = 0.00047194745;
const CFM_PER_LS = 2.1188799727;
const M2_PER_FT2 = 0.09290304;
const M_PER_FT = 0.3048;

/**
 * Effective leakage area at 4 Pa (C_D = 1), cm², from a pressurization result: the flow coefficient
 * c = Q/Δp^n of the power law Q = c·Δp^n, then A_L = 10 000·c·4^n·√(ρ/(2·4)). [PUB: ASHRAE Handbook—Fundamentals
 * 2021 ch. 16 eqs. (40), (41) and (44)]
 */
export function effectiveLeakageAreaCm2({
  flowM3s,
  pressurePa,
  exponent = DEFAULT_PRESSURE_EXPONENT,
}: {
  readonly flowM3s: number;
  readonly pressurePa: number;
  readonly exponent?: number;
}): number {
  const n = num(exponent, 'positive');
  const c = num(flowM3s, 'nonNegative') / num(pressurePa, 'positive') ** n;
  return 10000 * c * 4 ** n * Math.sqrt(LEAKAGE_AIR_DENSITY / 8);
}

/** A blower-door CFM50 as an effective leakage area, cm² (n = 0.65 unless given). */
export function leakageAreaFromCfm50Cm2(cfm50: number, exponent = DEFAULT_PRESSURE_EXPONENT): number {
  return effectiveLeakageAreaCm2({ flowM3s: num(cfm50, 'nonNegative') * M3S_PER_CFM, pressurePa: 50, exponent });
}

/** Leakage area from tightness, cm²: exposed surface (ft²) × the unit leakage area of the tightness. */
export function leakageAreaFromTightnessCm2(exposedFt2: number, tightness: Tightness): number {
  return num(exposedFt2, 'nonNegative') * M2_PER_FT2 * UNIT_LEAKAGE_AREA_CM2_PER_M2[tightness];
}

/**
 * Infiltration driving force, L/(s·cm²), for a stack height (m), an indoor–outdoor difference (K) and the flue's
 * share of the leakage area (0 unless given; the equation holds up to ½):
 * IDF = ([1 + I2·(A_L,flue/A_L)]·I0 + I1·H·|Δt|)/1000. [PUB: ch. 17 eq. (10). The public copy prints it garbled
 * by extraction but with the bracket before I0; ch. 16's enhanced (AIM-2) model, which eq. (10) is fitted to, agrees:
 * with its Tables 7–9 (2017 edition, as reproduced in public code) a flue's extra leakage barely follows H·Δt, so it
 * belongs on the constant I0, not on the stack term — tests/calc/infiltration.test.ts works that. With no flue, as
 * the load method uses it, the form is checked against every cell of the chapter's Table 5]
 */
export function infiltrationDrivingForce({
  stackHeightM,
  deltaTK,
  season,
  flueFraction = 0,
}: {
  readonly stackHeightM: number;
  readonly deltaTK: number;
  readonly season: LeakageSeason;
  readonly flueFraction?: number;
}): number {
  const k = IDF_COEFFICIENTS[season];
  const flue = 1 + k.i2 * num(flueFraction, 'fraction');
  return (flue * k.i0 + k.i1 * num(stackHeightM, 'nonNegative') * Math.abs(num(deltaTK))) / 1000;
}

/** Design leakage of the house, cfm = A_L (cm²) × IDF (L/s per cm²) in cfm, from feet and °F. No rounding. */
export function designLeakageCfm({
  leakageAreaCm2,
  stackHeightFt,
  deltaTF,
  season,
}: {
  readonly leakageAreaCm2: number;
  readonly stackHeightFt: number;
  readonly deltaTF: number;
  readonly season: LeakageSeason;
}): number {
  const idf = infiltrationDrivingForce({ stackHeightM: stackHeightFt * M_PER_FT, deltaTK: (deltaTF * 5) / 9, season });
  return leakageAreaCm2 * idf * CFM_PER_LS;
}

/**
 * The house's stack height, ft: the average height of the top ceiling above grade — the sum, over the above-grade
 * storeys (floor level 1 and up), of each storey's floor-area-weighted ceiling height; the tallest ceiling when
 * no room is above grade. [PUB: ch. 17 "building stack height H is the average height difference between the
 * ceiling and floor (or grade)"; the per-storey sum is our stated reading for rooms entered storey by storey]
 */
export function houseStackHeightFt(
  rooms: readonly { readonly floorLevel: number; readonly ceilingHeightFt: number; readonly areaFt2: number }[],
): number {
  const levels = new Map<number, { area: number; weighted: number }>();
  let tallest = 0;
  for (const r of rooms) {
    tallest = Math.max(tallest, r.ceilingHeightFt);
    if (r.floorLevel < 1) continue;
    const l = levels.get(r.floorLevel) ?? { area: 0, weighted: 0 };
    l.area += r.areaFt2;
    l.weighted += r.areaFt2 * r.ceilingHeightFt;
    levels.set(r.floorLevel, l);
  }
  if (levels.size === 0) return tallest;
  let h = 0;
  for (const l of levels.values()) h += l.area > 0 ? l.weighted / l.area : 0;
  return h;
}
