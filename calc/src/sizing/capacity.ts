import { assert, num } from '../errors';
import type { CapacityPoint } from '../schemas/equipment';

/** Capacity at a design outdoor temperature and whether the data covered it. */
export interface CapacityAt {
  readonly btuh: number;
  /** True when the temperature lies outside the maker's points ("outside the maker's data"). */
  readonly extrapolated: boolean;
  /**
   * How the figure was found: between two points, extended along the nearest segment (outside the
   * data, two or more points), or held at the only point there is.
   */
  readonly method?: 'interpolated' | 'extended' | 'held';
  /** The points used (°F), nearest first: one for 'held', two otherwise. */
  readonly fromF?: readonly number[];
}

/** True when the points are already in ascending outdoor temperature (the usual catalog order). */
function isAscending(points: readonly CapacityPoint[]): boolean {
  for (let i = 1; i < points.length; i += 1) {
    if (!((points[i - 1]?.outdoorF ?? -Infinity) <= (points[i]?.outdoorF ?? Infinity))) return false;
  }
  return true;
}

/** Straight line through two points evaluated at t, Btu/h (never below 0). */
function along(lo: CapacityPoint, hi: CapacityPoint, t: number): number {
  const f = hi.outdoorF === lo.outdoorF ? 0 : (t - lo.outdoorF) / (hi.outdoorF - lo.outdoorF);
  return Math.max(0, lo.btuh + f * (hi.btuh - lo.btuh));
}

/**
 * Capacity at `outdoorF`, Btu/h, by linear interpolation between the maker's expanded-data
 * points [PUB (secondary): Manual S — use expanded data at design conditions]. Outside the data
 * the nearest segment is extended (capacity keeps falling as the heating temperature drops or the
 * cooling temperature rises, instead of being held at the last rating, which overstated it) and
 * `extrapolated` is true, so the screen says "outside the maker's data"; with one point that
 * point is held. Never below 0. No rounding.
 */
export function capacityAtOutdoorF({
  points,
  outdoorF,
}: {
  readonly points: readonly CapacityPoint[];
  readonly outdoorF: number;
}): CapacityAt {
  const t = num(outdoorF);
  assert(points.length > 0, 'EMPTY_LIST');
  const ascending = isAscending(points);
  const sorted = ascending ? points : [...points].sort((a, b) => a.outdoorF - b.outdoorF);
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  assert(first !== undefined && last !== undefined, 'EMPTY_LIST');
  const second = sorted[1];
  const beforeLast = sorted[sorted.length - 2];
  if (t < first.outdoorF || t > last.outdoorF) {
    if (second === undefined || beforeLast === undefined)
      return { btuh: first.btuh, extrapolated: true, method: 'held', fromF: [first.outdoorF] };
    return t < first.outdoorF
      ? {
          btuh: along(first, second, t),
          extrapolated: true,
          method: 'extended',
          fromF: [first.outdoorF, second.outdoorF],
        }
      : {
          btuh: along(beforeLast, last, t),
          extrapolated: true,
          method: 'extended',
          fromF: [last.outdoorF, beforeLast.outdoorF],
        };
  }
  if (t === first.outdoorF)
    return { btuh: first.btuh, extrapolated: false, method: 'interpolated', fromF: [first.outdoorF] };
  for (let i = 1; i < sorted.length; i += 1) {
    const hi = sorted[i];
    const lo = sorted[i - 1];
    if (hi && lo && t <= hi.outdoorF)
      return { btuh: along(lo, hi, t), extrapolated: false, method: 'interpolated', fromF: [lo.outdoorF, hi.outdoorF] };
  }
  return { btuh: last.btuh, extrapolated: false, method: 'interpolated', fromF: [last.outdoorF] };
}

/** Sizing ratio = capacity ÷ load (unitless). Load must be > 0. No rounding. */
export function sizingRatio({
  loadBtuh,
  capacityBtuh,
}: {
  readonly loadBtuh: number;
  readonly capacityBtuh: number;
}): number {
  return num(capacityBtuh, 'nonNegative') / num(loadBtuh, 'positive');
}
