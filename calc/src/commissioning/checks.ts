import { num } from '../errors';
import { STANDARD_ATM_PSIA } from '../units';

const RANKINE = 459.67;

/**
 * Standing nitrogen test gauge pressure at a new temperature, psig: ideal gas at fixed
 * volume, P₂ = (P₁ + 14.696) × T₂/T₁ − 14.696 with absolute °R. [PUB: ideal-gas law;
 * reference check 9.3] No rounding.
 */
export function nitrogenTestPsigAt({
  psig,
  fromF,
  toF,
}: {
  readonly psig: number;
  readonly fromF: number;
  readonly toF: number;
}): number {
  const p1 = num(psig) + STANDARD_ATM_PSIA;
  const t1 = num(fromF) + RANKINE;
  const t2 = num(toF) + RANKINE;
  num(t1, 'positive');
  num(t2, 'positive');
  return (p1 * t2) / t1 - STANDARD_ATM_PSIA;
}

/**
 * Evacuation verdict: `reached` when the reading got to the target (≤ target microns),
 * `held` when after isolation it stayed ≤ the allowed rise, `pass` when both. [PUB:
 * UL-derived instructions — 500 microns, ≤ 1,500 after 10 min; TRADE: 1,000-micron policy]
 */
export function evacuationVerdict({
  reachedMicrons,
  afterHoldMicrons,
  targetMicrons,
  maxRiseToMicrons,
}: {
  readonly reachedMicrons: number;
  readonly afterHoldMicrons: number;
  readonly targetMicrons: number;
  readonly maxRiseToMicrons: number;
}): { reached: boolean; held: boolean; pass: boolean } {
  const reached = num(reachedMicrons, 'nonNegative') <= num(targetMicrons, 'nonNegative');
  const held = num(afterHoldMicrons, 'nonNegative') <= num(maxRiseToMicrons, 'nonNegative');
  return { reached, held, pass: reached && held };
}

/** Largest allowed gauge resolution for a standing test, psi = 5 % of test pressure. [PUB: UL-derived A2L instructions] */
export function maxGaugeResolutionPsi({ testPsig }: { readonly testPsig: number }): number {
  return 0.05 * num(testPsig, 'positive');
}

/**
 * Minimum condensate drain fall, in = length(ft) × 1/8 in per ft (IMC 307.2.1: 1/8 unit
 * vertical in 12 units horizontal; 30 ft → 3.75 in, slightly more than a strict 1 %).
 * [PUB: IMC 307.2.1] No rounding.
 */
export function condensateFallIn({ lengthFt }: { readonly lengthFt: number }): number {
  return num(lengthFt, 'nonNegative') * 0.125;
}
