import { assert, num } from './errors';
import { GRAINS_PER_LB, STANDARD_ATM_PSIA } from './units';

/**
 * Moist-air properties in I-P units, from ASHRAE Handbook—Fundamentals 2017 ch. 1
 * (the equations psychrolib implements). [PUB: ASHRAE Fundamentals 2017 ch. 1]
 * Temperatures °F, pressures psia, humidity ratio lb water / lb dry air. No rounding.
 */

const RANKINE_OFFSET = 459.67;
/** Ratio of molecular masses water / dry air. [PUB: ASHRAE 2017 ch. 1 eq. 20] */
const MOLAR_RATIO = 0.621945;
/** Triple point of water, °F; below it saturation is over ice. [PUB: ASHRAE 2017 ch. 1] */
const TRIPLE_POINT_F = 32.018;

/** Saturation pressure, psia, at `dryBulbF` (already checked) with t = dryBulbF + 459.67 °R > 0. */
function saturationPressureAt(dryBulbF: number, t: number): number {
  const lnP =
    dryBulbF <= TRIPLE_POINT_F
      ? -1.0214165e4 / t -
        4.8932428 -
        5.3765794e-3 * t +
        1.9202377e-7 * t ** 2 +
        3.5575832e-10 * t ** 3 -
        9.0344688e-14 * t ** 4 +
        4.1635019 * Math.log(t)
      : -1.0440397e4 / t -
        1.129465e1 -
        2.7022355e-2 * t +
        1.289036e-5 * t ** 2 -
        2.4780681e-9 * t ** 3 +
        6.5459673 * Math.log(t);
  return Math.exp(lnP);
}

/** Saturation vapour pressure, psia; eq. 5 (ice, ≤ 32.018 °F) and eq. 6 (water). */
export function saturationPressurePsia({ dryBulbF }: { readonly dryBulbF: number }): number {
  const t = num(dryBulbF) + RANKINE_OFFSET;
  assert(t > 0, 'ABSOLUTE_ZERO');
  return saturationPressureAt(dryBulbF, t);
}

/** Standard-atmosphere pressure at elevation, psia; eq. 3: 14.696 (1 − 6.8754e-6 Z)^5.2559. */
export function standardPressurePsia({ elevationFt }: { readonly elevationFt: number }): number {
  return STANDARD_ATM_PSIA * (1 - 6.8754e-6 * num(elevationFt)) ** 5.2559;
}

/** Altitude factor for the air-stream constants: p_station / p_sea-level. [MEM: ASHRAE ch. 17] */
export function altitudeFactor({ elevationFt }: { readonly elevationFt: number }): number {
  return standardPressurePsia({ elevationFt }) / STANDARD_ATM_PSIA;
}

/** Humidity ratio from vapour partial pressure; eq. 20: W = 0.621945 pw / (p − pw). */
export function humidityRatioFromVaporPressure({
  vaporPsia,
  pressurePsia,
}: {
  readonly vaporPsia: number;
  readonly pressurePsia: number;
}): number {
  const pw = num(vaporPsia, 'nonNegative');
  const p = num(pressurePsia, 'positive');
  assert(pw < p, 'PRESSURE_OUT_OF_RANGE');
  return (MOLAR_RATIO * pw) / (p - pw);
}

/** Humidity ratio from dry bulb and relative humidity (0–1); eq. 12 and 20. */
export function humidityRatioFromRh({
  dryBulbF,
  rh,
  pressurePsia,
}: {
  readonly dryBulbF: number;
  readonly rh: number;
  readonly pressurePsia: number;
}): number {
  const vaporPsia = num(rh, 'fraction') * saturationPressurePsia({ dryBulbF });
  return humidityRatioFromVaporPressure({ vaporPsia, pressurePsia });
}

/** Humidity ratio from dry bulb and thermodynamic wet bulb; eq. 35 (wet surface) / 37 (ice). */
export function humidityRatioFromWetBulb({
  dryBulbF,
  wetBulbF,
  pressurePsia,
}: {
  readonly dryBulbF: number;
  readonly wetBulbF: number;
  readonly pressurePsia: number;
}): number {
  const tdb = num(dryBulbF);
  const twb = num(wetBulbF);
  assert(twb <= tdb, 'WET_BULB_ABOVE_DRY_BULB');
  const wsStar = humidityRatioFromVaporPressure({
    vaporPsia: saturationPressurePsia({ dryBulbF: twb }),
    pressurePsia,
  });
  const w =
    twb >= 32
      ? ((1093 - 0.556 * twb) * wsStar - 0.24 * (tdb - twb)) / (1093 + 0.444 * tdb - twb)
      : ((1220 - 0.04 * twb) * wsStar - 0.24 * (tdb - twb)) / (1220 + 0.444 * tdb - 0.48 * twb);
  return Math.max(w, 1e-7);
}

/** Moist-air enthalpy, Btu/lb dry air; eq. 32: h = 0.240 t + W (1061 + 0.444 t). */
export function moistAirEnthalpyBtuPerLb({
  dryBulbF,
  humidityRatio,
}: {
  readonly dryBulbF: number;
  readonly humidityRatio: number;
}): number {
  const t = num(dryBulbF);
  return 0.24 * t + num(humidityRatio, 'nonNegative') * (1061 + 0.444 * t);
}

/**
 * Dew point, °F: the temperature whose saturation pressure equals the vapour pressure
 * (eq. 5/6 inverted by 50 bisection steps over −148…392 °F; deterministic, ±1e-12 °F).
 */
export function dewPointF({
  humidityRatio,
  pressurePsia,
}: {
  readonly humidityRatio: number;
  readonly pressurePsia: number;
}): number {
  const w = num(humidityRatio, 'positive');
  const pw = (num(pressurePsia, 'positive') * w) / (MOLAR_RATIO + w);
  let lo = -148;
  let hi = 392;
  for (let i = 0; i < 50; i += 1) {
    const mid = (lo + hi) / 2;
    if (saturationPressureAt(mid, mid + RANKINE_OFFSET) < pw)
      lo = mid; // mid ≥ −148 °F, so t > 0
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** lb/lb → grains per lb dry air (× 7000). */
export function grainsFromHumidityRatio({ humidityRatio }: { readonly humidityRatio: number }): number {
  return num(humidityRatio) * GRAINS_PER_LB;
}
