import { CalcError, assert, num } from '../errors';

/** One row of NEC Table 310.16, copper, ≤ 3 current-carrying conductors, 30 °C ambient, A. */
export interface AmpacityRow {
  readonly awg: number;
  readonly c60: number;
  readonly c75: number;
  readonly c90: number;
}

/** NEC Table 310.16 copper rows 14–4 AWG. [PUB: NFPA 70 (2023) Table 310.16 as reproduced by wiresizes.com / voltagelab.com] */
export const NEC_310_16_COPPER: readonly AmpacityRow[] = [
  { awg: 14, c60: 15, c75: 20, c90: 25 },
  { awg: 12, c60: 20, c75: 25, c90: 30 },
  { awg: 10, c60: 30, c75: 35, c90: 40 },
  { awg: 8, c60: 40, c75: 50, c90: 55 },
  { awg: 6, c60: 55, c75: 65, c90: 75 },
  { awg: 4, c60: 70, c75: 85, c90: 95 },
];

/** Standard overcurrent-device ratings up to 200 A. [MEM: NEC 240.6(A)] */
export const STANDARD_BREAKERS_A: readonly number[] = [
  15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200,
];

function column(terminationC: unknown): 'c60' | 'c75' {
  assert(terminationC === 60 || terminationC === 75, 'UNKNOWN_TERMINATION');
  return terminationC === 60 ? 'c60' : 'c75';
}

/** Ampacity of a copper AWG size in the 60 or 75 °C column, A. [PUB: NEC Table 310.16] */
export function copperAmpacityA({
  awg,
  terminationC,
}: {
  readonly awg: number;
  readonly terminationC: 60 | 75;
}): number {
  const row = NEC_310_16_COPPER.find((r) => r.awg === awg);
  if (!row) throw new CalcError('AMPACITY_ABOVE_TABLE');
  return row[column(terminationC)];
}

/**
 * Smallest copper AWG (14…4) whose NEC 310.16 ampacity in the 60 or 75 °C column is at
 * least `ampacityA`. [PUB: NEC Table 310.16; MEM: 110.14(C) termination limit] Throws
 * AMPACITY_ABOVE_TABLE above 4 AWG.
 */
export function copperWireAwg({
  ampacityA,
  terminationC,
}: {
  readonly ampacityA: number;
  readonly terminationC: 60 | 75;
}): number {
  const need = num(ampacityA, 'nonNegative');
  const col = column(terminationC);
  const row = NEC_310_16_COPPER.find((r) => r[col] >= need);
  if (!row) throw new CalcError('AMPACITY_ABOVE_TABLE');
  return row.awg;
}

/** 75 °C-column ambient correction factor (30 °C basis). [PUB: NEC Table 310.15(B)(1) via wiresizes.com] */
export function ambientFactor75C({ ambientC }: { readonly ambientC: number }): number {
  const t = num(ambientC);
  if (t <= 30) return 1;
  if (t <= 35) return 0.94;
  if (t <= 40) return 0.88;
  if (t <= 45) return 0.82;
  if (t <= 50) return 0.75;
  throw new CalcError('AMPACITY_ABOVE_TABLE');
}

/**
 * Breaker rating: the largest standard rating not above MOCP [PUB: NEC 440.4(B)/440.35
 * marked MOCP; MEM: 240.6(A)]; it must also be ≥ MCA, else NO_STANDARD_BREAKER.
 */
export function breakerSizeA({ mcaA, mocpA }: { readonly mcaA: number; readonly mocpA: number }): number {
  const mca = num(mcaA, 'positive');
  const mocp = num(mocpA, 'positive');
  const fits = STANDARD_BREAKERS_A.filter((a) => a <= mocp + 1e-9);
  const best = fits[fits.length - 1];
  if (best === undefined || best < mca) throw new CalcError('NO_STANDARD_BREAKER');
  return best;
}

/** MCA, A = 1.25 × largest motor RLA + Σ other loads. [PUB: UL 1995 method in a packaged-unit manual] No rounding. */
export function mcaFromNameplateA({
  largestRlaA,
  otherLoadsA = 0,
}: {
  readonly largestRlaA: number;
  readonly otherLoadsA?: number;
}): number {
  return 1.25 * num(largestRlaA, 'nonNegative') + num(otherLoadsA, 'nonNegative');
}

/**
 * MOCP, A = 2.25 × largest RLA + Σ others, rounded DOWN to a standard rating but not below
 * MCA (then the next standard rating up). [PUB: UL 1995 §36 method; MEM: rounding rule]
 */
export function mocpFromNameplateA({
  largestRlaA,
  otherLoadsA = 0,
}: {
  readonly largestRlaA: number;
  readonly otherLoadsA?: number;
}): number {
  const raw = 2.25 * num(largestRlaA, 'nonNegative') + num(otherLoadsA, 'nonNegative');
  const mca = mcaFromNameplateA({ largestRlaA, otherLoadsA });
  const down = STANDARD_BREAKERS_A.filter((a) => a <= raw + 1e-9).pop();
  if (down !== undefined && down >= mca) return down;
  const up = STANDARD_BREAKERS_A.find((a) => a >= mca);
  if (up === undefined) throw new CalcError('NO_STANDARD_BREAKER');
  return up;
}

/** Disconnect "within sight": visible and ≤ 50 ft. [PUB: NEC 440.14; NEC Art. 100 "within sight"] */
export function disconnectWithinSight({
  distanceFt,
  visible,
}: {
  readonly distanceFt: number;
  readonly visible: boolean;
}): boolean {
  return visible === true && num(distanceFt, 'nonNegative') <= 50;
}
