import { num } from '../errors';
import type { Refrigerant } from './charge';

/** ASHRAE 34 safety class and GWP (IPCC AR4). [PUB: CoolProp ASHRAE-34 table; GWP 2088/675; MEM: EPA 466] */
export const REFRIGERANT_INFO = {
  'R-410A': { safetyClass: 'A1', gwp: 2088, lflKgPerM3: null },
  'R-32': { safetyClass: 'A2L', gwp: 675, lflKgPerM3: 0.307 },
  'R-454B': { safetyClass: 'A2L', gwp: 466, lflKgPerM3: 0.296 },
} as const satisfies Record<Refrigerant, { safetyClass: string; gwp: number; lflKgPerM3: number | null }>;

/** True for lower-flammability (A2L) refrigerants. */
export function isA2l({ refrigerant }: { readonly refrigerant: Refrigerant }): boolean {
  return REFRIGERANT_INFO[refrigerant].safetyClass === 'A2L';
}

/** m1 = 6 m³ × LFL, kg: below it no room-area requirement. [PUB: IEC 60335-2-40:2018 GG.2 via a manufacturer manual] */
export function a2lM1Kg({ lflKgPerM3 }: { readonly lflKgPerM3: number }): number {
  return 6 * num(lflKgPerM3, 'positive');
}

/**
 * Maximum charge for a room, kg = 2.5 × LFL^(5/4) × h0 × √A (h0 ≥ 0.6 m).
 * [PUB: IEC 60335-2-40:2018 Annex GG, reproduced in equipment manuals] No rounding.
 */
export function a2lMaxChargeKg({
  lflKgPerM3,
  h0M,
  roomAreaM2,
}: {
  readonly lflKgPerM3: number;
  readonly h0M: number;
  readonly roomAreaM2: number;
}): number {
  const h0 = Math.max(0.6, num(h0M, 'nonNegative'));
  return 2.5 * num(lflKgPerM3, 'positive') ** 1.25 * h0 * Math.sqrt(num(roomAreaM2, 'nonNegative'));
}

/** Minimum room area, m² = (M / (2.5 × LFL^(5/4) × h0))². [PUB: IEC 60335-2-40:2018 Annex GG] No rounding. */
export function a2lMinRoomAreaM2({
  chargeKg,
  lflKgPerM3,
  h0M,
}: {
  readonly chargeKg: number;
  readonly lflKgPerM3: number;
  readonly h0M: number;
}): number {
  const h0 = Math.max(0.6, num(h0M, 'nonNegative'));
  return (num(chargeKg, 'nonNegative') / (2.5 * num(lflKgPerM3, 'positive') ** 1.25 * h0)) ** 2;
}

/** Reference installation height by indoor-unit type, m. [PUB: IEC 60335-2-40:2018 Annex GG via manuals] */
export const A2L_INSTALL_HEIGHT_M = {
  'wall-head': 1.8,
  'ceiling-cassette': 2.2,
  'floor-console': 0,
  'slim-ducted': 0.6,
  'ducted-air-handler': 0.6,
} as const;
