import { floorAreaFt2, wallDoorAreaFt2, wallGrossAreaFt2, wallWindowAreaFt2 } from '../geometry';
import type { Room } from '../schemas/room-input';
import type { DesignConditions } from '../schemas/design-conditions';
import { roundHalfUp } from '../rounding';

/** A plain-word warning with the field it concerns (for the form). */
export interface PlausibilityWarning {
  readonly path: readonly (string | number)[];
  readonly message: string;
}

/**
 * Soft checks on a room that passed the schema: values that are allowed but unusual
 * enough that the salesperson should look again. Never throws.
 */
export function roomPlausibilityWarnings(room: Room): PlausibilityWarning[] {
  const out: PlausibilityWarning[] = [];
  const area = floorAreaFt2(room);
  if (room.ceilingHeightFt < 7)
    out.push({
      path: ['ceilingHeightFt'],
      message: `A ${roundHalfUp(room.ceilingHeightFt, 1)} ft ceiling is unusually low — check the measurement.`,
    });
  if (room.ceilingHeightFt > 14)
    out.push({
      path: ['ceilingHeightFt'],
      message: `A ${roundHalfUp(room.ceilingHeightFt, 1)} ft ceiling is unusually high — check it, or enter the real wall heights.`,
    });
  if (area < 25)
    out.push({
      path: ['lengthFt'],
      message: `${roundHalfUp(area)} ft² is very small for a room — check the length and width.`,
    });
  if (area > 1500)
    out.push({
      path: ['lengthFt'],
      message: `${roundHalfUp(area)} ft² is very large for one room — consider splitting it.`,
    });
  if (
    room.lengthFt !== undefined &&
    room.widthFt !== undefined &&
    Math.max(room.lengthFt, room.widthFt) > 8 * Math.min(room.lengthFt, room.widthFt)
  ) {
    out.push({
      path: ['widthFt'],
      message: 'The room is more than eight times longer than it is wide — check the dimensions.',
    });
  }
  room.exposedWalls.forEach((wall, i) => {
    const gross = wallGrossAreaFt2(wall, room.ceilingHeightFt);
    const glass = wallWindowAreaFt2(wall);
    if (glass + wallDoorAreaFt2(wall) > gross) {
      out.push({
        path: ['exposedWalls', i, 'windows'],
        message: 'The windows and doors on this wall are larger than the wall itself.',
      });
    } else if (glass > 0.6 * gross) {
      out.push({
        path: ['exposedWalls', i, 'windows'],
        message: 'More than 60 % of this wall is glass — check the window sizes.',
      });
    }
    if (
      room.lengthFt !== undefined &&
      room.widthFt !== undefined &&
      wall.lengthFt > Math.max(room.lengthFt, room.widthFt) + 0.5
    ) {
      out.push({
        path: ['exposedWalls', i, 'lengthFt'],
        message: 'This wall is longer than the room — check its length.',
      });
    }
  });
  if (room.occupants > 0 && area / room.occupants < 20)
    out.push({
      path: ['occupants'],
      message: 'That is a lot of people for this floor area — check the occupant count.',
    });
  if (room.exposedWalls.length === 0 && room.above.kind === 'conditioned' && room.below.kind === 'conditioned') {
    out.push({
      path: ['exposedWalls'],
      message: 'No outside walls, roof or floor: only people, appliances and air leakage will count.',
    });
  }
  return out;
}

/** Soft checks on design conditions (values the schema allows but that deserve a second look). */
export function designConditionsWarnings(c: DesignConditions): PlausibilityWarning[] {
  const out: PlausibilityWarning[] = [];
  if (c.indoorHeatingF > 72)
    out.push({
      path: ['indoorHeatingF'],
      message: 'Energy codes cap the heating design set point at 72 °F for load calculations.',
    });
  if (c.indoorCoolingF < 75)
    out.push({
      path: ['indoorCoolingF'],
      message: 'Energy codes set the cooling design set point at no lower than 75 °F for load calculations.',
    });
  if (c.outdoorCoolingDryBulbF <= c.indoorCoolingF)
    out.push({
      path: ['outdoorCoolingDryBulbF'],
      message:
        'The outdoor cooling design temperature is not above the indoor set point: little or no cooling load from outside.',
    });
  return out;
}
