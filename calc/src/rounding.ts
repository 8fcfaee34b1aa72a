import { num } from './errors';

/** 10 ** n for the usual decimal counts (exact: the same values `10 ** n` gives), saving a pow per rounding. */
const POWERS_OF_TEN: readonly number[] = [1, 10, 100, 1000, 10000, 100000, 1000000];

/**
 * Rounds half away from zero ("half-up" for the non-negative quantities calc deals in)
 * to `decimals` places. Uses an exponent shift plus a 1e-9 relative nudge so that
 * binary representation error (1.005 stored as 1.00499…) still rounds up.
 * Unitless; the caller's unit is kept.
 */
export function roundHalfUp(value: number, decimals = 0): number {
  const v = num(value);
  const factor = POWERS_OF_TEN[decimals] ?? 10 ** decimals;
  const shifted = Math.abs(v) * factor;
  const rounded = Math.floor(shifted + 0.5 + shifted * 1e-12) / factor;
  return v < 0 ? -rounded : rounded;
}

/** Rounds a fractional number of cents half-up to whole integer cents. */
export function roundCentsHalfUp(cents: number): number {
  return roundHalfUp(cents, 0);
}

/** Rounds up to the next multiple of `step` (e.g. stock lengths, whole cylinders). */
export function roundUpTo(value: number, step: number): number {
  const v = num(value, 'nonNegative');
  const s = num(step, 'positive');
  return Math.ceil(v / s - 1e-9) * s;
}
