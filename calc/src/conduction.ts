import { assert, num } from './errors';

/**
 * U-factor of layers in series, Btu/h·ft²·°F = 1 / ΣR (R in h·ft²·°F/Btu; air films are
 * the caller's layers). [PUB: basic heat transfer; ORNL whole-wall paper] No rounding.
 */
export function seriesU({ rValues }: { readonly rValues: readonly number[] }): number {
  assert(Array.isArray(rValues) && rValues.length > 0, 'EMPTY_LIST');
  const total = rValues.reduce<number>((sum, r) => sum + num(r, 'nonNegative'), 0);
  assert(total > 0, 'NOT_POSITIVE');
  return 1 / total;
}

/**
 * Parallel-path U: (1 − f) × U_cavity + f × U_framing, f = framing fraction 0–1.
 * [PUB: ORNL whole-wall paper; MEM: ASHRAE Fundamentals ch. 27] No rounding.
 */
export function parallelPathU({
  cavityU,
  framingU,
  framingFraction,
}: {
  readonly cavityU: number;
  readonly framingU: number;
  readonly framingFraction: number;
}): number {
  const f = num(framingFraction, 'fraction');
  return (1 - f) * num(cavityU, 'nonNegative') + f * num(framingU, 'nonNegative');
}

/**
 * Conduction, Btu/h = U × A × ΔT. [PUB: U-factor definition, IECC] Negative ΔT is
 * allowed (heat flows out); area and U must be non-negative. No rounding.
 */
export function conductionBtuh({
  u,
  areaFt2,
  deltaTF,
}: {
  readonly u: number;
  readonly areaFt2: number;
  readonly deltaTF: number;
}): number {
  return num(u, 'nonNegative') * num(areaFt2, 'nonNegative') * num(deltaTF);
}

/** I-P R-value → RSI (m²·K/W), ÷ 5.678263. [PUB: SI/NIST] */
export function rsiFromR({ r }: { readonly r: number }): number {
  return num(r, 'nonNegative') / 5.678263;
}

/** Slab-edge heat loss, Btu/h = F × perimeter(ft) × ΔT; F in Btu/h·ft·°F. [MEM: ASHRAE/IECC F-factor] */
export function slabEdgeBtuh({
  fFactor,
  perimeterFt,
  deltaTF,
}: {
  readonly fFactor: number;
  readonly perimeterFt: number;
  readonly deltaTF: number;
}): number {
  return num(fFactor, 'nonNegative') * num(perimeterFt, 'nonNegative') * num(deltaTF);
}
