import { DOOR_TYPES, GLAZING_TYPES, interiorAttenuation, WALL_CONSTRUCTIONS } from '../construction-defaults';
import { doorAreaFt2, wallAboveGradeFt2, windowAreaFt2 } from '../geometry';
import type { Wall } from '../schemas/room';

type CompassDirection = Wall['direction'];
import { HOURS, radiantTimeSeries } from './design-day-context';
import { RADIANT_FRACTION, SHADED_SUN_RADIANT_FRACTION } from './hourly-method';
import type { LoadComponents, RoomHourly } from './room-load';

/** One façade of a room at its peak hour, Btu/h; the façades add up to the room's components. */
export interface FacadePart {
  readonly direction: CompassDirection;
  readonly netWallFt2: number;
  readonly windowFt2: number;
  readonly wallsBtuh: number;
  readonly doorsBtuh: number;
  readonly windowsConductionBtuh: number;
  readonly windowsSolarBtuh: number;
}

/** The drill-down of a room's sensible gain at its peak hour. */
export interface PeakDetail {
  readonly hour: number;
  readonly facades: readonly FacadePart[];
}

/** A part's raw figure, or 0 when it is not a positive finite number. */
const cleanRaw = (r: number): number => (r > 0 && Number.isFinite(r) ? r : 0);

/** Scratch space for `apportion`'s remainders and their selection (grown as needed; apportion never re-enters). */
let remScratch = new Float64Array(64);
let pickScratch = new Float64Array(64);

/**
 * The k-th largest (1-based) of the first n values of `a`, by quickselect; `a`'s order is changed.
 * Hoare partition about the middle value, descending.
 */
function kthLargest(a: Float64Array, n: number, k: number): number {
  const target = k - 1;
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const pivot = a[(lo + hi) >> 1] ?? 0;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while ((a[i] ?? 0) > pivot) i += 1;
      while ((a[j] ?? 0) < pivot) j -= 1;
      if (i <= j) {
        const x = a[i] ?? 0;
        a[i] = a[j] ?? 0;
        a[j] = x;
        i += 1;
        j -= 1;
      }
    }
    if (target <= j) hi = j;
    else if (target >= i) lo = i;
    else return a[target] ?? 0;
  }
  return a[lo] ?? 0;
}

/**
 * Shares an integer `total` among parts in proportion to `raws` (each ≥ 0) by largest remainder,
 * so the parts are integers that add up to the total. [OWN: the screen's breakdown always adds up]
 */
export function apportion(total: number, raws: ArrayLike<number>): number[] {
  const n = raws.length;
  if (n === 0) return [];
  let sum = 0;
  for (let k = 0; k < n; k += 1) sum += cleanRaw(raws[k] ?? 0);
  const out = new Array<number>(n).fill(0);
  if (!(sum > 0)) {
    out[0] = total;
    return out;
  }
  if (remScratch.length < n) {
    remScratch = new Float64Array(n);
    pickScratch = new Float64Array(n);
  }
  const rems = remScratch;
  // Each part's floor and remainder; the leftover 1s go to the largest remainders (the earlier part on a tie).
  let floors = 0;
  for (let k = 0; k < n; k += 1) {
    const e = (total * cleanRaw(raws[k] ?? 0)) / sum;
    const f = Math.floor(e);
    out[k] = f;
    floors += f;
    rems[k] = e - f;
  }
  const left = total - floors;
  if (!(left > 0)) return out;
  // One leftover 1 per whole or part unit left, at most one per part, to the `ones` parts first in the order
  // (larger remainder, then earlier part): every part whose remainder is above the `ones`-th largest remainder t,
  // then the earliest parts whose remainder equals t. t by quickselect on a copy; one pass in part order hands out.
  const ones = Math.min(n, Math.ceil(left));
  pickScratch.set(rems.subarray(0, n));
  const t = kthLargest(pickScratch, n, ones);
  let atT = ones;
  for (let k = 0; k < n; k += 1) if ((rems[k] ?? 0) > t) atT -= 1;
  for (let k = 0; k < n; k += 1) {
    const r = rems[k] ?? 0;
    if (r > t) out[k] = (out[k] ?? 0) + 1;
    else if (r === t && atT > 0) {
      out[k] = (out[k] ?? 0) + 1;
      atT -= 1;
    }
  }
  return out;
}

/**
 * `apportion(total, raws)[j]` without sharing among the others: the same arithmetic in the same
 * order, and part j gets its extra 1 when fewer than the leftover parts rank before it (larger
 * remainder, or the same remainder and an earlier index) — no arrays and no sort, two passes over
 * the parts, so one room's share of a house figure is cheap. 0 for an index outside `raws`.
 */
export function apportionShare(total: number, raws: ArrayLike<number>, j: number): number {
  const n = raws.length;
  if (j < 0 || j >= n) return 0;
  let sum = 0;
  for (let k = 0; k < n; k += 1) sum += cleanRaw(raws[k] ?? 0);
  if (!(sum > 0)) return j === 0 ? total : 0;
  const exact = (total * cleanRaw(raws[j] ?? 0)) / sum;
  const base = Math.floor(exact);
  const rem = exact - base;
  let floors = 0;
  let before = 0;
  for (let k = 0; k < n; k += 1) {
    const e = (total * cleanRaw(raws[k] ?? 0)) / sum;
    const f = Math.floor(e);
    floors += f;
    const r = e - f;
    if (r > rem || (r === rem && k < j)) before += 1;
  }
  // apportion hands the leftover 1s out in remainder order while any is left.
  return before < total - floors ? base + 1 : base;
}

const massOf = (construction: string) => (construction.startsWith('masonry') ? 'masonry' : 'frame');
const pos = (x: number): number => (x > 0 ? x : 0);

/** Walls, doors and windows by façade at the room's peak hour, the same terms as the hourly method. */
export function peakDetail(w: RoomHourly, gain: LoadComponents): PeakDetail {
  const { room, ctx } = w;
  const h = w.peakIndex;
  const glassOver = ctx.windowLoadDt(true)[h] ?? 0;
  const glassUnder = ctx.windowLoadDt(false)[h] ?? 0;
  const order: CompassDirection[] = [];
  const raw = new Map<
    CompassDirection,
    { net: number; glass: number; walls: number; doors: number; cond: number; sun: number }
  >();
  for (const wall of room.exposedWalls) {
    const fs = ctx.facing[wall.direction];
    const color = wall.color ?? 'medium';
    let acc = raw.get(wall.direction);
    if (!acc) {
      acc = { net: 0, glass: 0, walls: 0, doors: 0, cond: 0, sun: 0 };
      raw.set(wall.direction, acc);
      order.push(wall.direction);
    }
    let openings = 0;
    for (const win of wall.windows) {
      const g = GLAZING_TYPES[win.glazing].value;
      const a = windowAreaFt2(win);
      openings += a;
      acc.glass += a;
      const shgc = win.shgc ?? g.shgc;
      acc.cond += (win.uFactor ?? g.u) * a * (shgc > 0.5 ? glassOver : glassUnder);
      const iac = interiorAttenuation(win.interiorShading, shgc);
      const shaded = win.interiorShading === 'none' ? null : win.interiorShading;
      const k = a * shgc * iac;
      const depth = win.overhangDepthFt ?? 0;
      if (depth > 0) {
        const heightFt = win.heightIn !== undefined ? win.heightIn / 12 : Math.sqrt(a / win.count);
        const gap = win.overhangGapFt ?? 0;
        const beam = new Float64Array(HOURS);
        for (let i = 0; i < HOURS; i += 1) {
          const cut = Math.min(heightFt, pos(depth * (fs.profileTan[i] ?? 0) - gap));
          const sunlit = heightFt > 0 ? 1 - cut / heightFt : 1;
          beam[i] = k * (fs.glassBeam[i] ?? 0) * sunlit;
        }
        const beamLoad = shaded
          ? radiantTimeSeries(beam, SHADED_SUN_RADIANT_FRACTION[shaded], ctx.rts.nonsolar)
          : radiantTimeSeries(beam, RADIANT_FRACTION.sunUnshaded, ctx.rts.solar);
        acc.sun += (beamLoad[h] ?? 0) + k * ((shaded ? fs.shaded[shaded].diffuseLoad : fs.diffuseLoad)[h] ?? 0);
      } else acc.sun += k * ((shaded ? fs.shaded[shaded].solarLoad : fs.solarLoad)[h] ?? 0);
    }
    for (const d of wall.doors) {
      const a = doorAreaFt2(d);
      openings += a;
      acc.doors +=
        (d.uFactor ?? DOOR_TYPES[d.doorType].value) * a * (ctx.wallLoadDt(wall.direction, color, 'frame')[h] ?? 0);
    }
    const net = Math.max(0, wallAboveGradeFt2(wall, room.ceilingHeightFt) - openings);
    acc.net += net;
    acc.walls +=
      (wall.uFactor ?? WALL_CONSTRUCTIONS[wall.construction].value) *
      net *
      (ctx.wallLoadDt(wall.direction, color, massOf(wall.construction))[h] ?? 0);
  }
  const list = order.map((d) => raw.get(d) ?? { net: 0, glass: 0, walls: 0, doors: 0, cond: 0, sun: 0 });
  const walls = apportion(
    gain.walls,
    list.map((x) => x.walls),
  );
  const doors = apportion(
    gain.doors,
    list.map((x) => x.doors),
  );
  const cond = apportion(
    gain.windowsConduction,
    list.map((x) => x.cond),
  );
  const sun = apportion(
    gain.windowsSolar,
    list.map((x) => x.sun),
  );
  return {
    hour: h + 1,
    facades: order.map((direction, i) => ({
      direction,
      netWallFt2: Math.round((list[i]?.net ?? 0) * 10) / 10,
      windowFt2: Math.round((list[i]?.glass ?? 0) * 10) / 10,
      wallsBtuh: walls[i] ?? 0,
      doorsBtuh: doors[i] ?? 0,
      windowsConductionBtuh: cond[i] ?? 0,
      windowsSolarBtuh: sun[i] ?? 0,
    })),
  };
}
