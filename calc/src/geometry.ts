import type { Door, Wall, Window } from './schemas/room';

/**
 * Areas of room surfaces, ft². Window/door sizes are in inches (÷ 144 in²/ft²) or a
 * direct area; `count` multiplies. No rounding. Input is already schema-valid.
 */

/** Area of one window entry (all `count` panes), ft². */
export function windowAreaFt2(w: Pick<Window, 'areaFt2' | 'widthIn' | 'heightIn' | 'count'>): number {
  const each = w.areaFt2 ?? ((w.widthIn ?? 0) * (w.heightIn ?? 0)) / 144;
  return each * w.count;
}

/** Area of one door entry (all `count` doors), ft². */
export function doorAreaFt2(d: Pick<Door, 'areaFt2' | 'widthIn' | 'heightIn' | 'count'>): number {
  const each = d.areaFt2 ?? ((d.widthIn ?? 0) * (d.heightIn ?? 0)) / 144;
  return each * d.count;
}

/** Gross area of a wall, ft² = length × (wall height, else the room's ceiling height). */
export function wallGrossAreaFt2(wall: Pick<Wall, 'lengthFt' | 'heightFt'>, ceilingHeightFt: number): number {
  return wall.lengthFt * (wall.heightFt ?? ceilingHeightFt);
}

/** The part of a wall above grade, ft² (a basement wall's lower `belowGradeFt` is in the ground). */
export function wallAboveGradeFt2(
  wall: Pick<Wall, 'lengthFt' | 'heightFt' | 'belowGradeFt'>,
  ceilingHeightFt: number,
): number {
  return wall.lengthFt * Math.max(0, (wall.heightFt ?? ceilingHeightFt) - (wall.belowGradeFt ?? 0));
}

/** Total window area on a wall, ft². */
export function wallWindowAreaFt2(wall: Pick<Wall, 'windows'>): number {
  return wall.windows.reduce((sum, w) => sum + windowAreaFt2(w), 0);
}

/** Total door area on a wall, ft². */
export function wallDoorAreaFt2(wall: Pick<Wall, 'doors'>): number {
  return wall.doors.reduce((sum, d) => sum + doorAreaFt2(d), 0);
}

/** Net opaque wall area, ft² = gross − windows − doors, never below 0. */
export function wallNetAreaFt2(wall: Wall, ceilingHeightFt: number): number {
  return Math.max(0, wallGrossAreaFt2(wall, ceilingHeightFt) - wallWindowAreaFt2(wall) - wallDoorAreaFt2(wall));
}

/** Floor area, ft²: length × width, or the entered area. */
export function floorAreaFt2(room: {
  readonly lengthFt?: number | undefined;
  readonly widthFt?: number | undefined;
  readonly areaFt2?: number | undefined;
}): number {
  return room.areaFt2 ?? (room.lengthFt ?? 0) * (room.widthFt ?? 0);
}
