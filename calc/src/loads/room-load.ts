import { floorAreaFt2 } from '../geometry';
import { parseOrThrow } from '../parse';
import { roundHalfUp } from '../rounding';
import { designConditionsSchema, type DesignConditionsInput } from '../schemas/design-conditions';
import { roomInputSchema, type Room, type RoomInput } from '../schemas/room-input';
import { tightnessSchema, type Tightness } from '../schemas/home';
import { INFILTRATION_TIGHTNESS } from '../construction-defaults';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { ceilingLoad, exposedWallsLoad, floorLoad } from './envelope';
import { appliancesLoad, infiltrationLoad, peopleLoad } from './internal';
import { METHOD_NOTES } from './notes';

/** Load components, Btu/h, each rounded half-up to 1 Btu/h; `total` = sum of the rounded parts. */
export interface LoadComponents {
  readonly walls: number;
  readonly windowsConduction: number;
  readonly windowsSolar: number;
  readonly doors: number;
  readonly ceiling: number;
  readonly floor: number;
  readonly infiltration: number;
  readonly people: number;
  readonly appliances: number;
  readonly total: number;
}

export type ComponentKey = Exclude<keyof LoadComponents, 'total'>;
export const COMPONENT_KEYS: readonly ComponentKey[] = [
  'walls',
  'windowsConduction',
  'windowsSolar',
  'doors',
  'ceiling',
  'floor',
  'infiltration',
  'people',
  'appliances',
];

/** One room's estimated loads. */
export interface RoomLoad {
  readonly roomId: string;
  readonly roomName: string;
  readonly floorAreaFt2: number;
  readonly volumeFt3: number;
  readonly infiltrationCfm: number;
  readonly sensibleGain: LoadComponents;
  readonly latentGain: LoadComponents;
  readonly heatLoss: LoadComponents;
  readonly coolingTotalBtuh: number;
  readonly notes: readonly string[];
  readonly isEstimate: true;
}

type Parts = Record<ComponentKey, number>;

/** Rounds each part half-up to 1 Btu/h and adds a total equal to their sum. */
export function toComponents(parts: Parts): LoadComponents {
  const walls = roundHalfUp(parts.walls);
  const windowsConduction = roundHalfUp(parts.windowsConduction);
  const windowsSolar = roundHalfUp(parts.windowsSolar);
  const doors = roundHalfUp(parts.doors);
  const ceiling = roundHalfUp(parts.ceiling);
  const floor = roundHalfUp(parts.floor);
  const infiltration = roundHalfUp(parts.infiltration);
  const people = roundHalfUp(parts.people);
  const appliances = roundHalfUp(parts.appliances);
  const total = walls + windowsConduction + windowsSolar + doors + ceiling + floor + infiltration + people + appliances;
  return { walls, windowsConduction, windowsSolar, doors, ceiling, floor, infiltration, people, appliances, total };
}

/** Room loads from already-parsed inputs (the engine path used by homeLoad). */
export function roomLoadFromParsed(room: Room, p: DesignPsychrometrics, homeAch: number): RoomLoad {
  const { walls, windowsConduction: glass, windowsSolar, doors } = exposedWallsLoad(room, p);
  const ceiling = ceilingLoad(room, p);
  const floor = floorLoad(room, p);
  const air = infiltrationLoad(room, p, homeAch);
  const people = peopleLoad(room);
  const appliances = appliancesLoad(room);
  const area = floorAreaFt2(room);
  const sensibleGain = toComponents({
    walls: walls.cooling,
    windowsConduction: glass.cooling,
    windowsSolar,
    doors: doors.cooling,
    ceiling: ceiling.cooling,
    floor: floor.cooling,
    infiltration: air.sensibleCooling,
    people: people.sensible,
    appliances: appliances.sensible,
  });
  const latentGain = toComponents({
    walls: 0,
    windowsConduction: 0,
    windowsSolar: 0,
    doors: 0,
    ceiling: 0,
    floor: 0,
    infiltration: air.latentCooling,
    people: people.latent,
    appliances: appliances.latent,
  });
  const heatLoss = toComponents({
    walls: walls.heating,
    windowsConduction: glass.heating,
    windowsSolar: 0,
    doors: doors.heating,
    ceiling: ceiling.heating,
    floor: floor.heating,
    infiltration: air.heating,
    people: 0,
    appliances: 0,
  });
  return {
    roomId: room.id,
    roomName: room.name,
    floorAreaFt2: roundHalfUp(area, 1),
    volumeFt3: roundHalfUp(area * room.ceilingHeightFt, 0),
    infiltrationCfm: roundHalfUp(air.cfm, 1),
    sensibleGain,
    latentGain,
    heatLoss,
    coolingTotalBtuh: sensibleGain.total + latentGain.total,
    notes: METHOD_NOTES,
    isEstimate: true,
  };
}

/**
 * One room's sensible and latent heat gain and heat loss, Btu/h, by component.
 * Validates the room and conditions (throws CalcError INVALID_INPUT with field details).
 * Method: see METHOD_NOTES. Each component rounded half-up to 1 Btu/h.
 */
export function roomLoad({
  room,
  designConditions,
  tightness = 'average',
}: {
  readonly room: RoomInput;
  readonly designConditions: DesignConditionsInput;
  readonly tightness?: Tightness;
}): RoomLoad {
  const r = parseOrThrow(roomInputSchema, room);
  const c = parseOrThrow(designConditionsSchema, designConditions);
  const t = parseOrThrow(tightnessSchema, tightness);
  return roomLoadFromParsed(r, designPsychrometrics(c), INFILTRATION_TIGHTNESS[t].value);
}
