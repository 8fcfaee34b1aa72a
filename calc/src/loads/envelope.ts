import { conductionBtuh, slabEdgeBtuh } from '../conduction';
import {
  ADJACENT_SPACE, CEILING_INSULATION, DOOR_TYPES, FLOOR_INSULATION, GLAZING_TYPES, INTERIOR_SHADING_IAC,
  PEAK_IRRADIANCE_BTUH_FT2, SLAB_EDGE, WALL_CONSTRUCTIONS,
} from '../construction-defaults';
import { doorAreaFt2, floorAreaFt2, wallNetAreaFt2, windowAreaFt2 } from '../geometry';
import type { Room } from '../schemas/room-input';
import type { Window } from '../schemas/room';
import type { DesignPsychrometrics } from './conditions';

/** A conduction component: cooling gain and heating loss, Btu/h, unrounded, each ≥ 0. */
export interface CoolHeat {
  readonly cooling: number;
  readonly heating: number;
}

const pos = (x: number): number => Math.max(0, x);

/** Cooling ΔT for glass conduction, °F = ΔT_c − 0.46 × daily range, ≥ 0. [MEM: ASHRAE ch. 17 RLF fenestration term] */
export function glassCoolingDeltaTF(p: DesignPsychrometrics): number {
  return pos(p.coolingDeltaTF - 0.46 * p.dailyRangeF);
}

/** Opaque walls: U (construction or override) × net area × ΔT. [PUB: Q = U·A·ΔT] */
export function wallsLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  let cooling = 0;
  let heating = 0;
  for (const wall of room.exposedWalls) {
    const u = wall.uFactor ?? WALL_CONSTRUCTIONS[wall.construction].value;
    const area = wallNetAreaFt2(wall, room.ceilingHeightFt);
    cooling += pos(conductionBtuh({ u, areaFt2: area, deltaTF: p.coolingDeltaTF }));
    heating += conductionBtuh({ u, areaFt2: area, deltaTF: p.heatingDeltaTF });
  }
  return { cooling, heating };
}

/** Window U and SHGC: the entered label values, else the glazing default. */
export function windowProperties(w: Window): { u: number; shgc: number } {
  const d = GLAZING_TYPES[w.glazing].value;
  return { u: w.uFactor ?? d.u, shgc: w.shgc ?? d.shgc };
}

/** Window conduction: U × A × ΔT (glass cooling ΔT reduced by daily range). */
export function windowsConductionLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  const glassDt = glassCoolingDeltaTF(p);
  let cooling = 0;
  let heating = 0;
  for (const wall of room.exposedWalls) {
    for (const w of wall.windows) {
      const { u } = windowProperties(w);
      const a = windowAreaFt2(w);
      cooling += conductionBtuh({ u, areaFt2: a, deltaTF: glassDt });
      heating += conductionBtuh({ u, areaFt2: a, deltaTF: p.heatingDeltaTF });
    }
  }
  return { cooling, heating };
}

/**
 * Solar gain through glass, Btu/h = A × SHGC × peak irradiance(facing) × IAC.
 * [PUB: SHGC definition; irradiance factors are a documented simplification, MEM/TRADE]
 */
export function solarGainBtuh({ areaFt2, shgc, irradiance, iac }: { areaFt2: number; shgc: number; irradiance: number; iac: number }): number {
  return areaFt2 * shgc * irradiance * iac;
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
        iac: INTERIOR_SHADING_IAC[w.interiorShading].value,
      });
    }
  }
  return total;
}

/** Doors: U × A × ΔT (opaque-door ΔT as walls). */
export function doorsLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  let cooling = 0;
  let heating = 0;
  for (const wall of room.exposedWalls) {
    for (const d of wall.doors) {
      const u = d.uFactor ?? DOOR_TYPES[d.doorType].value;
      cooling += pos(conductionBtuh({ u, areaFt2: doorAreaFt2(d), deltaTF: p.coolingDeltaTF }));
      heating += conductionBtuh({ u, areaFt2: doorAreaFt2(d), deltaTF: p.heatingDeltaTF });
    }
  }
  return { cooling, heating };
}

/** Ceiling: U(insulation) × floor area × ΔT, attic/roof cooling ΔT raised by the sun adders [TRADE]. */
export function ceilingLoad(room: Room, p: DesignPsychrometrics): CoolHeat {
  if (room.above.kind === 'conditioned') return { cooling: 0, heating: 0 };
  const u = CEILING_INSULATION[room.above.insulation].value;
  const adder = room.above.kind === 'attic' ? ADJACENT_SPACE.atticCoolingAdderF.value : ADJACENT_SPACE.roofCoolingAdderF.value;
  const area = floorAreaFt2(room);
  return {
    cooling: pos(conductionBtuh({ u, areaFt2: area, deltaTF: p.coolingDeltaTF + adder })),
    heating: conductionBtuh({ u, areaFt2: area, deltaTF: p.heatingDeltaTF }),
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
  const fractions = below.kind === 'garage' ? ADJACENT_SPACE.garage.value
    : below.kind === 'basement' ? ADJACENT_SPACE.basement.value
      : below.vented ? ADJACENT_SPACE.crawlspaceVented.value : ADJACENT_SPACE.crawlspaceClosed.value;
  const u = FLOOR_INSULATION[below.insulation].value;
  const area = floorAreaFt2(room);
  return {
    cooling: pos(conductionBtuh({ u, areaFt2: area, deltaTF: p.coolingDeltaTF * fractions.cooling })),
    heating: conductionBtuh({ u, areaFt2: area, deltaTF: p.heatingDeltaTF * fractions.heating }),
  };
}
