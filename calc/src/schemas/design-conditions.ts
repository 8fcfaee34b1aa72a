import { z } from 'zod';
import { bounded, boundedInt } from './fields';

/** Latitude assumed when the job has none, degrees north. [OWN: a stated assumption, shown with the result] */
export const DEFAULT_LATITUDE_DEG = 40;

/**
 * Clear-sky optical depths used when the site's are unknown: τb 0.40, τd 2.30. A Gaugeline
 * generic value, NOT a station's data: typical of mid-latitude summer months in the
 * handbook's climatic tables [MEM]. Enter the station's τb/τd from ASHRAE ch. 14 climatic data.
 * (Here beside the schema, not in the solar model, so a form can say them without loading the engine.)
 */
export const GENERIC_CLEAR_SKY = {
  tauB: 0.4,
  tauD: 2.3,
  source: 'Generic default (not the site’s data): τb 0.40, τd 2.30, typical mid-latitude summer [MEM]',
} as const;

/**
 * Site design conditions (°F, %, ft). Cooling outdoor humidity is given either as the
 * coincident wet bulb or directly as grains per lb. [PUB: IRC R301.2(1) design criteria
 * fields; IECC R302.1 72 °F heating / 75 °F cooling interior design — PUB (secondary)]
 */
export const designConditionsSchema = z
  .object({
    outdoorCoolingDryBulbF: bounded('Outdoor cooling dry bulb', 50, 130, '°F'),
    outdoorCoolingWetBulbF: bounded('Outdoor coincident wet bulb', 30, 95, '°F').optional(),
    outdoorCoolingGrains: bounded('Outdoor humidity', 0, 220, 'grains/lb').optional(),
    outdoorHeatingDryBulbF: bounded('Outdoor heating dry bulb', -60, 70, '°F'),
    indoorCoolingF: bounded('Indoor cooling set point', 60, 90, '°F').default(75),
    indoorHeatingF: bounded('Indoor heating set point', 50, 85, '°F').default(70),
    indoorCoolingRhPercent: bounded('Indoor relative humidity', 20, 80, '%').default(50),
    dailyRangeF: bounded('Daily temperature range', 0, 50, '°F').default(20),
    elevationFt: bounded('Elevation', -300, 14000, 'ft').default(0),
    source: z.string().max(200, 'Source must be at most 200 characters').optional(),
    /**
     * Design ground surface temperature for basement walls and floors: the site's annual mean outdoor
     * temperature less the ground surface temperature amplitude (ASHRAE ch. 18 below-grade method).
     * Unknown → the outdoor heating design temperature, which overstates the loss, and the loads say so.
     */
    groundDesignF: bounded('Design ground surface temperature', -40, 80, '°F').optional(),
    /** Site latitude, degrees (north positive). Unknown → calc assumes 40° N and says so. */
    latitudeDeg: bounded('Latitude', -60, 70, '°').optional(),
    /** Month of the cooling design day (its 21st); unset: July north of the equator, January south. [PUB: ASHRAE ch. 14 monthly design days] */
    designMonth: boundedInt('Design month', 1, 12).optional(),
    /** Clear-sky optical depths of the site and month (ASHRAE ch. 14 climatic data); both or neither. */
    clearSkyTauB: bounded('Beam optical depth τb', 0.1, 1.5).optional(),
    clearSkyTauD: bounded('Diffuse optical depth τd', 1, 3.5).optional(),
    clearSkySource: z.string().max(200, 'Source must be at most 200 characters').optional(),
  })
  .superRefine((d, ctx) => {
    if (d.outdoorCoolingWetBulbF === undefined && d.outdoorCoolingGrains === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['outdoorCoolingWetBulbF'],
        message: 'Enter the coincident wet bulb or the outdoor humidity in grains',
      });
    }
    if ((d.clearSkyTauB === undefined) !== (d.clearSkyTauD === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [d.clearSkyTauB === undefined ? 'clearSkyTauB' : 'clearSkyTauD'],
        message: 'Enter both optical depths (τb and τd) from the same climatic table, or neither',
      });
    }
    if (d.outdoorCoolingWetBulbF !== undefined && d.outdoorCoolingWetBulbF > d.outdoorCoolingDryBulbF) {
      ctx.addIssue({
        code: 'custom',
        path: ['outdoorCoolingWetBulbF'],
        message: 'Wet bulb cannot be above the dry bulb',
      });
    }
    if (d.outdoorHeatingDryBulbF >= d.indoorHeatingF) {
      ctx.addIssue({
        code: 'custom',
        path: ['outdoorHeatingDryBulbF'],
        message: 'Outdoor heating design temperature must be below the indoor heating set point',
      });
    }
  });

export type DesignConditionsInput = z.input<typeof designConditionsSchema>;
export type DesignConditions = z.output<typeof designConditionsSchema>;
