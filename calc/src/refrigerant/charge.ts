import { num } from '../errors';
import { OZ_PER_LB } from '../units';
import { tubeVolumeIn3PerFt } from './tube';

/**
 * Refrigerant held by a liquid-full line, oz/ft = π/4·ID² × 12 ÷ 1728 × ρ(lb/ft³) × 16.
 * [PUB: ASTM B280 IDs; densities from published EOS (reference §8)] No rounding.
 */
export function liquidLineChargeOzPerFt({
  odIn,
  liquidDensityLbPerFt3,
}: {
  readonly odIn: number;
  readonly liquidDensityLbPerFt3: number;
}): number {
  return (tubeVolumeIn3PerFt({ odIn }) / 1728) * num(liquidDensityLbPerFt3, 'positive') * OZ_PER_LB;
}

/**
 * Charge to add beyond the pre-charged length, oz = max(0, L − L_pre) × adder.
 * Never negative: no charge is removed for a short run ("no removal" policy). [TRADE;
 * reference §8 formula] No rounding.
 */
export function extraChargeOz({
  lengthFt,
  prechargedLengthFt,
  ozPerFt,
}: {
  readonly lengthFt: number;
  readonly prechargedLengthFt: number;
  readonly ozPerFt: number;
}): number {
  const beyond = num(lengthFt, 'nonNegative') - num(prechargedLengthFt, 'nonNegative');
  return Math.max(0, beyond) * num(ozPerFt, 'nonNegative');
}

/**
 * Saturated-liquid density at 100 °F, lb/ft³, for the tube-volume fallback estimate.
 * [PUB: computed from the published EOS / mixture models named in reference §8]
 */
export const LIQUID_DENSITY_100F_LB_FT3 = {
  'R-410A': 61.76,
  'R-32': 56.43,
  'R-454B': 57.93,
} as const;

export type Refrigerant = keyof typeof LIQUID_DENSITY_100F_LB_FT3;
