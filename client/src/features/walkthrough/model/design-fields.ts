import type { DesignField } from '@contract';
import type { Quantity } from '../../../lib/unit-display';

export interface DesignFieldSpec {
  readonly key: DesignField;
  readonly label: string;
  readonly quantity: Quantity;
  readonly unit?: string;
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
];
