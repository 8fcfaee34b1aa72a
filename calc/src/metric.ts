import type { DesignConditionsInput } from './schemas/design-conditions';
import type { RoomInput } from './schemas/room-input';
import type { WallInput } from './schemas/room';
import { fDeltaFromKelvin, fFromC, ft2FromM2, ftFromM, inFromCm } from './units';

/**
 * Edge converters for metric forms. A metric form fills the same fields with metric
 * numbers — lengths in m, window and door sizes in cm, areas in m², temperatures in °C,
 * temperature range in K — and these return the canonical imperial input. Appliance gains
 * are already W or Btu/h.
 */

const opt = <T>(v: T | undefined, f: (x: T) => number): number | undefined => (v === undefined ? undefined : f(v));

function wallFromMetric(w: WallInput): WallInput {
  return {
    ...w,
    lengthFt: ftFromM({ m: w.lengthFt }),
    heightFt: opt(w.heightFt, (m) => ftFromM({ m })),
    windows: (w.windows ?? []).map((win) => ({
      ...win,
      widthIn: opt(win.widthIn, (cm) => inFromCm({ cm })),
      heightIn: opt(win.heightIn, (cm) => inFromCm({ cm })),
      areaFt2: opt(win.areaFt2, (m2) => ft2FromM2({ m2 })),
    })),
    doors: (w.doors ?? []).map((d) => ({
      ...d,
      widthIn: opt(d.widthIn, (cm) => inFromCm({ cm })),
      heightIn: opt(d.heightIn, (cm) => inFromCm({ cm })),
      areaFt2: opt(d.areaFt2, (m2) => ft2FromM2({ m2 })),
    })),
  };
}

/** A room entered in metric → the canonical imperial room input (convert-units). */
export function roomFromMetric(room: RoomInput): RoomInput {
  return {
    ...room,
    lengthFt: opt(room.lengthFt, (m) => ftFromM({ m })),
    widthFt: opt(room.widthFt, (m) => ftFromM({ m })),
    areaFt2: opt(room.areaFt2, (m2) => ft2FromM2({ m2 })),
    ceilingHeightFt: opt(room.ceilingHeightFt, (m) => ftFromM({ m })),
    exposedWalls: (room.exposedWalls ?? []).map(wallFromMetric),
  };
}

/** Design conditions entered in °C, m and K → canonical °F, ft (grains stay grains per lb: g/kg × 7). */
export function designConditionsFromMetric(c: DesignConditionsInput): DesignConditionsInput {
  return {
    ...c,
    outdoorCoolingDryBulbF: fFromC({ c: c.outdoorCoolingDryBulbF }),
    outdoorCoolingWetBulbF: opt(c.outdoorCoolingWetBulbF, (x) => fFromC({ c: x })),
    outdoorCoolingGrains: opt(c.outdoorCoolingGrains, (gPerKg) => gPerKg * 7),
    outdoorHeatingDryBulbF: fFromC({ c: c.outdoorHeatingDryBulbF }),
    indoorCoolingF: opt(c.indoorCoolingF, (x) => fFromC({ c: x })),
    indoorHeatingF: opt(c.indoorHeatingF, (x) => fFromC({ c: x })),
    dailyRangeF: opt(c.dailyRangeF, (k) => fDeltaFromKelvin({ deltaK: k })),
    elevationFt: opt(c.elevationFt, (m) => ftFromM({ m })),
  };
}
