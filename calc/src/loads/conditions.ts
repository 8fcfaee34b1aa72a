import type { DesignConditions } from '../schemas/design-conditions';
import {
  altitudeFactor,
  dewPointF,
  grainsFromHumidityRatio,
  humidityRatioFromRh,
  humidityRatioFromWetBulb,
  moistAirEnthalpyBtuPerLb,
  standardPressurePsia,
} from '../psychrometrics';
import { GRAINS_PER_LB } from '../units';

/** Everything the room-load components need from the site, computed once per home. */
export interface DesignPsychrometrics {
  readonly pressurePsia: number;
  readonly altitudeFactor: number;
  readonly indoorHumidityRatio: number;
  readonly outdoorHumidityRatio: number;
  readonly indoorGrains: number;
  readonly outdoorGrains: number;
  /** Outdoor − indoor grains, ≥ 0 (a dry climate gives no latent infiltration gain). */
  readonly deltaGrains: number;
  readonly indoorDewPointF: number;
  readonly indoorEnthalpyBtuPerLb: number;
  readonly outdoorEnthalpyBtuPerLb: number;
  /** Outdoor − indoor cooling dry bulb, °F (may be ≤ 0 for a mild site). */
  readonly coolingDeltaTF: number;
  /** Indoor − outdoor heating, °F (> 0 by schema). */
  readonly heatingDeltaTF: number;
  /** Indoor heating − design ground surface temperature, °F (basement walls and floors). */
  readonly groundDeltaTF: number;
  /** True when no ground temperature was entered and the outdoor heating design temperature stands in. */
  readonly groundAssumed: boolean;
  readonly dailyRangeF: number;
  readonly outdoorCoolingF: number;
  readonly outdoorHeatingF: number;
  readonly indoorCoolingF: number;
  readonly indoorHeatingF: number;
}

/**
 * Site psychrometrics at the station pressure for the elevation (ASHRAE 2017 ch. 1):
 * indoor W from set point and RH, outdoor W from the coincident wet bulb (or grains).
 * No rounding (rounding happens on the load components).
 */
export function designPsychrometrics(c: DesignConditions): DesignPsychrometrics {
  const pressurePsia = standardPressurePsia({ elevationFt: c.elevationFt });
  const indoorW = humidityRatioFromRh({ dryBulbF: c.indoorCoolingF, rh: c.indoorCoolingRhPercent / 100, pressurePsia });
  const outdoorW =
    c.outdoorCoolingGrains !== undefined
      ? c.outdoorCoolingGrains / GRAINS_PER_LB
      : humidityRatioFromWetBulb({
          dryBulbF: c.outdoorCoolingDryBulbF,
          wetBulbF: c.outdoorCoolingWetBulbF ?? c.outdoorCoolingDryBulbF,
          pressurePsia,
        });
  const indoorGrains = grainsFromHumidityRatio({ humidityRatio: indoorW });
  const outdoorGrains = grainsFromHumidityRatio({ humidityRatio: outdoorW });
  return {
    pressurePsia,
    altitudeFactor: altitudeFactor({ elevationFt: c.elevationFt }),
    indoorHumidityRatio: indoorW,
    outdoorHumidityRatio: outdoorW,
    indoorGrains,
    outdoorGrains,
    deltaGrains: Math.max(0, outdoorGrains - indoorGrains),
    indoorDewPointF: dewPointF({ humidityRatio: indoorW, pressurePsia }),
    indoorEnthalpyBtuPerLb: moistAirEnthalpyBtuPerLb({ dryBulbF: c.indoorCoolingF, humidityRatio: indoorW }),
    outdoorEnthalpyBtuPerLb: moistAirEnthalpyBtuPerLb({ dryBulbF: c.outdoorCoolingDryBulbF, humidityRatio: outdoorW }),
    coolingDeltaTF: c.outdoorCoolingDryBulbF - c.indoorCoolingF,
    heatingDeltaTF: c.indoorHeatingF - c.outdoorHeatingDryBulbF,
    groundDeltaTF: Math.max(0, c.indoorHeatingF - (c.groundDesignF ?? c.outdoorHeatingDryBulbF)),
    groundAssumed: c.groundDesignF === undefined,
    dailyRangeF: c.dailyRangeF,
    outdoorCoolingF: c.outdoorCoolingDryBulbF,
    outdoorHeatingF: c.outdoorHeatingDryBulbF,
    indoorCoolingF: c.indoorCoolingF,
    indoorHeatingF: c.indoorHeatingF,
  };
}
