import { assert, num } from '../errors';
import type { CapacityPoint } from '../schemas/equipment';

/** Capacity at a design outdoor temperature and whether the data covered it. */
export interface CapacityAt {
  readonly btuh: number;
  readonly extrapolated: boolean;
}

/** True when the points are already in ascending outdoor temperature (the usual catalog order). */
function isAscending(points: readonly CapacityPoint[]): boolean {
  for (let i = 1; i < points.length; i += 1) {
    if (!((points[i - 1]?.outdoorF ?? -Infinity) <= (points[i]?.outdoorF ?? Infinity))) return false;
  }
  return true;
}

/**
 * Capacity at `outdoorF`, Btu/h, by linear interpolation between the maker's expanded-data
 * points [PUB (secondary): Manual S — use expanded data at design conditions]. Outside the
 * data the nearest point is held (no extrapolation) and `extrapolated` is true. No rounding.
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
  if (t <= first.outdoorF) return { btuh: first.btuh, extrapolated: t < first.outdoorF };
  if (t >= last.outdoorF) return { btuh: last.btuh, extrapolated: t > last.outdoorF };
  for (let i = 1; i < sorted.length; i += 1) {
    const hi = sorted[i];
    const lo = sorted[i - 1];
    if (hi && lo && t <= hi.outdoorF) {
      const f = hi.outdoorF === lo.outdoorF ? 0 : (t - lo.outdoorF) / (hi.outdoorF - lo.outdoorF);
      return { btuh: lo.btuh + f * (hi.btuh - lo.btuh), extrapolated: false };
    }
  }
  return { btuh: last.btuh, extrapolated: false };
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
