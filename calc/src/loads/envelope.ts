import { slabEdgeBtuh } from '../conduction';
import {
  ADJACENT_SPACE,
  CEILING_INSULATION,
  DOOR_TYPES,
  FLOOR_INSULATION,
  GLAZING_TYPES,
  interiorAttenuation,
  PEAK_IRRADIANCE_BTUH_FT2,
  SLAB_EDGE,
  WALL_CONSTRUCTIONS,
} from '../construction-defaults';
import { doorAreaFt2, floorAreaFt2, wallAboveGradeFt2, windowAreaFt2 } from '../geometry';
import { BASEMENT_FLOOR_BASE_R, basementFloorU, belowGradeWallU } from './below-grade';
import type { Room } from '../schemas/room-input';
import type { Window } from '../schemas/room';
import type { DesignPsychrometrics } from './conditions';

/** A conduction component: cooling gain and heating loss, Btu/h, unrounded, each ≥ 0. */
export interface CoolHeat {
  readonly cooling: number;
  readonly heating: number;
}

const pos = (x: number): number => Math.max(0, x);

/**
 * U × A × ΔT, Btu/h: `conductionBtuh` in positional form for the per-room loads below, where
 * U and A come from the construction tables or schema-valid rooms (finite, ≥ 0) and an object
 * argument per call would be allocated on the hot path. Same arithmetic, same result.
 */
const uaDt = (u: number, areaFt2: number, deltaTF: number): number => u * areaFt2 * deltaTF;

/** Cooling ΔT for glass conduction, °F = ΔT_c − 0.46 × daily range, ≥ 0. [MEM: ASHRAE ch. 17 RLF fenestration term] */
export function glassCoolingDeltaTF(p: DesignPsychrometrics): number {
  return pos(p.coolingDeltaTF - 0.46 * p.dailyRangeF);
}

/** Window U and SHGC: the entered label values, else the glazing default. */
export function windowProperties(w: Window): { u: number; shgc: number } {
  const d = GLAZING_TYPES[w.glazing].value;
  return { u: w.uFactor ?? d.u, shgc: w.shgc ?? d.shgc };
}

/**
 * Solar gain through glass, Btu/h = A × SHGC × peak irradiance(facing) × IAC.
 * [PUB: SHGC definition; irradiance factors are a documented simplification, MEM/TRADE]
 */
export function solarGainBtuh({
  areaFt2,
  shgc,
  irradiance,
  iac,
}: {
  areaFt2: number;
  shgc: number;
  irradiance: number;
  iac: number;
}): number {
  return areaFt2 * shgc * irradiance * iac;
}

/** Everything on a room's exposed walls, Btu/h, unrounded: opaque walls, window conduction and sun, doors. */
export interface ExposedWallsLoad {
  readonly walls: CoolHeat;
  readonly windowsConduction: CoolHeat;
  /** Cooling only. */
  readonly windowsSolar: number;
  readonly doors: CoolHeat;
}

/**
 * One pass over the exposed walls, each window and door visited once (area and U looked up
 * once), summing every component in wall order:
 * - opaque walls: U (construction or override) × net area × ΔT [PUB: Q = U·A·ΔT];
 * - window conduction: U × A × ΔT, the glass cooling ΔT reduced by daily range;
 * - sun through glass: `solarGainBtuh` per window (cooling only);
 * - doors: U × A × ΔT (opaque-door ΔT as walls).
 */
export function exposedWallsLoad(room: Room, p: DesignPsychrometrics): ExposedWallsLoad {
  const glassDt = glassCoolingDeltaTF(p);
  let wallsCooling = 0,
    wallsHeating = 0,
    glassCooling = 0,
    glassHeating = 0,
    solar = 0,
    doorsCooling = 0,
    doorsHeating = 0;
  for (const wall of room.exposedWalls) {
    let windowsArea = 0;
    const irradiance = PEAK_IRRADIANCE_BTUH_FT2[wall.direction];
    for (const w of wall.windows) {
      const glazing = GLAZING_TYPES[w.glazing].value; // = windowProperties(w)
      const u = w.uFactor ?? glazing.u;
      const shgc = w.shgc ?? glazing.shgc;
      const a = windowAreaFt2(w);
      windowsArea += a;
      glassCooling += uaDt(u, a, glassDt);
      glassHeating += uaDt(u, a, p.heatingDeltaTF);
      solar += a * shgc * irradiance * interiorAttenuation(w.interiorShading, shgc); // = solarGainBtuh
    }
    let doorsArea = 0;
    for (const d of wall.doors) {
      const u = d.uFactor ?? DOOR_TYPES[d.doorType].value;
      const a = doorAreaFt2(d);
      doorsArea += a;
      doorsCooling += pos(uaDt(u, a, p.coolingDeltaTF));
      doorsHeating += uaDt(u, a, p.heatingDeltaTF);
    }
    // = wallNetAreaFt2(wall, …), with the opening areas already summed above
    const net = Math.max(0, wallAboveGradeFt2(wall, room.ceilingHeightFt) - windowsArea - doorsArea);
    const u = wall.uFactor ?? WALL_CONSTRUCTIONS[wall.construction].value;
    wallsCooling += pos(uaDt(u, net, p.coolingDeltaTF));
    wallsHeating += uaDt(u, net, p.heatingDeltaTF);
    const z = wall.belowGradeFt ?? 0;
    // Below grade: the handbook's average U over the depth, the wall's own R as R_other; no summer gain.
    if (z > 0)
      wallsHeating += uaDt(belowGradeWallU({ z1Ft: 0, z2Ft: z, rOther: 1 / u }), wall.lengthFt * z, p.groundDeltaTF);
  }
  return {
    walls: { cooling: wallsCooling, heating: wallsHeating },
    windowsConduction: { cooling: glassCooling, heating: glassHeating },
    windowsSolar: solar,
    doors: { cooling: doorsCooling, heating: doorsHeating },
  };
}

/** Opaque walls: U (construction or override) × net area × ΔT. [PUB: Q = U·A·ΔT] */
export function wallsLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  return exposedWallsLoad(room, p).walls;
}

/** Window conduction: U × A × ΔT (glass cooling ΔT reduced by daily range). */
export function windowsConductionLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  return exposedWallsLoad(room, p).windowsConduction;
}

/** Sun through all the room's windows, Btu/h (cooling only). */
export function windowsSolarLoad(room: Room): number {
  let total = 0;
  for (const wall of room.exposedWalls) {
    for (const w of wall.windows) {
      total += solarGainBtuh({
        areaFt2: windowAreaFt2(w),
        shgc: windowProperties(w).shgc,
        irradiance: PEAK_IRRADIANCE_BTUH_FT2[wall.direction],
        iac: interiorAttenuation(w.interiorShading, windowProperties(w).shgc),
      });
    }
  }
  return total;
}

/** Doors: U × A × ΔT (opaque-door ΔT as walls). */
export function doorsLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  return exposedWallsLoad(room, p).doors;
}

/** Ceiling: U(insulation) × floor area × ΔT, attic/roof cooling ΔT raised by the sun adders [TRADE]. */
export function ceilingLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  if (room.above.kind === 'conditioned') return { cooling: 0, heating: 0 };
  const u = CEILING_INSULATION[room.above.insulation].value;
  const adder =
    room.above.kind === 'attic' ? ADJACENT_SPACE.atticCoolingAdderF.value : ADJACENT_SPACE.roofCoolingAdderF.value;
  const area = floorAreaFt2(room);
  return {
    cooling: pos(uaDt(u, area, p.coolingDeltaTF + adder)),
    heating: uaDt(u, area, p.heatingDeltaTF),
  };
}

/** Floor: slab edge F × exposed perimeter × ΔT (heating only); framed floors U × A × buffer ΔT [TRADE fractions]. */
export function floorLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  const below = room.below;
  if (below.kind === 'conditioned') return { cooling: 0, heating: 0 };
  if (below.kind === 'slab') {
    const f = below.edgeInsulated ? SLAB_EDGE.insulated.value : SLAB_EDGE.uninsulated.value;
    const perimeterFt = room.exposedWalls.reduce((sum, w) => sum + w.lengthFt, 0);
    return { cooling: 0, heating: slabEdgeBtuh({ fFactor: f, perimeterFt, deltaTF: p.heatingDeltaTF }) };
  }
  if (below.kind === 'basement-floor') {
    const area = floorAreaFt2(room);
    const sides = [room.lengthFt, room.widthFt].filter((x): x is number => x !== undefined);
    const widthFt = below.widthFt ?? (sides.length === 2 ? Math.min(...sides) : Math.sqrt(area));
    const u = basementFloorU({ widthFt, depthFt: below.depthFt, rOther: BASEMENT_FLOOR_BASE_R + below.insulationR });
    return { cooling: 0, heating: uaDt(u, area, p.groundDeltaTF) };
  }
  const fractions =
    below.kind === 'garage'
      ? ADJACENT_SPACE.garage.value
      : below.kind === 'basement'
        ? ADJACENT_SPACE.basement.value
        : below.vented
          ? ADJACENT_SPACE.crawlspaceVented.value
          : ADJACENT_SPACE.crawlspaceClosed.value;
  const u = FLOOR_INSULATION[below.insulation].value;
  const area = floorAreaFt2(room);
  return {
    cooling: pos(uaDt(u, area, p.coolingDeltaTF * fractions.cooling)),
    heating: uaDt(u, area, p.heatingDeltaTF * fractions.heating),
  };
}
