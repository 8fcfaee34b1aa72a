import { DEFAULT_LATITUDE_DEG, GENERIC_CLEAR_SKY } from '@calc';
import type { DesignField } from '@contract';
import type { Quantity } from '../../lib/unit-display';

export interface DesignFieldSpec {
  readonly key: DesignField;
  readonly label: string;
  readonly quantity: Quantity;
  readonly unit?: string;
  /** What calc does when the field is left empty (shown under it). */
  readonly whenEmpty?: string;
  readonly integer?: boolean;
}

/** How the form shows each of the contract's DESIGN_FIELDS (resolution itself is the contract's resolveDesign). */
export const DESIGN_FIELD_SPECS: readonly DesignFieldSpec[] = [
  { key: 'outdoorCoolingDryBulbF', label: 'Outdoor cooling dry bulb', quantity: 'degF' },
  { key: 'outdoorCoolingWetBulbF', label: 'Outdoor coincident wet bulb', quantity: 'degF' },
  {
    key: 'outdoorCoolingGrains',
    label: 'Outdoor humidity (instead of wet bulb)',
    quantity: 'plain',
    unit: 'grains/lb',
  },
  { key: 'outdoorHeatingDryBulbF', label: 'Outdoor heating dry bulb', quantity: 'degF' },
  { key: 'indoorCoolingF', label: 'Indoor cooling set point', quantity: 'degF' },
  { key: 'indoorHeatingF', label: 'Indoor heating set point', quantity: 'degF' },
  { key: 'indoorCoolingRhPercent', label: 'Indoor relative humidity', quantity: 'plain', unit: '%' },
  { key: 'dailyRangeF', label: 'Daily temperature range', quantity: 'deltaF' },
  { key: 'elevationFt', label: 'Elevation', quantity: 'elevation' },
  {
    key: 'latitudeDeg',
    label: 'Latitude',
    quantity: 'plain',
    unit: '°',
    whenEmpty: `Left empty: ${DEFAULT_LATITUDE_DEG}° N is assumed, and the loads say so. South of the equator press S.`,
  },
  {
    key: 'designMonth',
    label: 'Cooling design month',
    quantity: 'plain',
    unit: '1–12',
    integer: true,
    whenEmpty: 'Usual: July north of the equator, January south of it.',
  },
  {
    key: 'clearSkyTauB',
    label: 'Clear-sky beam optical depth τb',
    quantity: 'plain',
    whenEmpty: `Left empty (with τd): a generic clear sky, τb ${GENERIC_CLEAR_SKY.tauB.toFixed(2)} / τd ${GENERIC_CLEAR_SKY.tauD.toFixed(2)} — not the site’s data.`,
  },
  { key: 'clearSkyTauD', label: 'Clear-sky diffuse optical depth τd', quantity: 'plain' },
  {
    key: 'groundDesignF',
    label: 'Design ground temperature (basements)',
    quantity: 'degF',
    whenEmpty:
      'The site’s annual mean temperature less the ground surface amplitude. Left empty: the outdoor heating design temperature, which overstates basement losses.',
  },
];
