import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';
import { aboveSchema, applianceSchema, belowSchema, wallSchema } from './room';
import { roundHalfUp } from '../rounding';
import { doorAreaFt2, wallDoorAreaFt2, wallGrossAreaFt2, wallWindowAreaFt2, windowAreaFt2 } from '../geometry';

/**
 * One room as a salesperson enters it on a walk-through. Dimensions in ft; length ×
 * width, or a floor area. Hard bounds here; softer plausibility checks live in
 * `roomPlausibilityWarnings`. A wall's windows and doors may not exceed the wall.
 */
const roomObjectSchema = z.object({
  id: keyField('Room id'),
  name: nameField('Room name'),
  floorLevel: boundedInt('Floor level', -2, 5).default(1),
  lengthFt: bounded('Length', 1, 200, 'ft').optional(),
  widthFt: bounded('Width', 1, 200, 'ft').optional(),
  areaFt2: bounded('Floor area', 10, 10000, 'ft²').optional(),
  ceilingHeightFt: bounded('Ceiling height', 2, 40, 'ft').default(8),
  exposedWalls: z.array(wallSchema).max(8, 'At most 8 exposed walls per room').default([]),
  above: aboveSchema.default({ kind: 'conditioned' }),
  below: belowSchema.default({ kind: 'conditioned' }),
  occupants: boundedInt('Occupants', 0, 20).default(0),
  appliances: z.array(applianceSchema).max(20, 'At most 20 appliances per room').default([]),
  achOverride: bounded('Air changes per hour', 0, 5, 'ACH').optional(),
  notes: z.string().max(2000, 'Notes must be at most 2000 characters').default(''),
});

/** The field(s) that size an opening: its area when one was typed (it wins), else width and height. */
const sizeFields = (o: { readonly areaFt2?: number | undefined }) =>
  o.areaFt2 !== undefined ? (['areaFt2'] as const) : (['widthIn', 'heightIn'] as const);

const largestIndex = <T>(items: readonly T[], area: (x: T) => number) =>
  items.reduce((best, x, i, all) => (area(x) > area(all[best] ?? x) ? i : best), 0);

export const roomInputSchema = roomObjectSchema.superRefine((room, ctx) => {
  if (room.areaFt2 === undefined && (room.lengthFt === undefined || room.widthFt === undefined)) {
    ctx.addIssue({ code: 'custom', path: ['lengthFt'], message: 'Enter the length and width, or the floor area' });
  }
  room.exposedWalls.forEach((wall, wi) => {
    // A wall (or ceiling) size that is itself refused already has its message; comparing
    // openings against a 0 ft wall would only paint an empty field red.
    if (!wallSchema.safeParse(wall).success) return;
    if (wall.heightFt === undefined && !roomObjectSchema.shape.ceilingHeightFt.safeParse(room.ceilingHeightFt).success)
      return;
    const height = wall.heightFt ?? room.ceilingHeightFt;
    if (wall.belowGradeFt !== undefined && wall.belowGradeFt > height) {
      ctx.addIssue({
        code: 'custom',
        path: ['exposedWalls', wi, 'belowGradeFt'],
        message: `The depth below grade (${wall.belowGradeFt} ft) is more than the wall's height (${height} ft)`,
      });
      return;
    }
    const gross = wallGrossAreaFt2(wall, room.ceilingHeightFt);
    const windows = wallWindowAreaFt2(wall);
    const openings = windows + wallDoorAreaFt2(wall);
    const wallFt2 = roundHalfUp(gross);
    if (windows > gross) {
      const i = largestIndex(wall.windows, windowAreaFt2);
      const win = wall.windows[i];
      if (!win) return;
      const own = windowAreaFt2(win);
      const message =
        own > gross
          ? win.count > 1
            ? `The ${win.count} windows (${roundHalfUp(own)} ft²) are larger than their wall (${wallFt2} ft²)`
            : `The window (${roundHalfUp(own)} ft²) is larger than its wall (${wallFt2} ft²)`
          : `The windows (${roundHalfUp(windows)} ft²) are larger than the wall (${wallFt2} ft²)`;
      for (const field of sizeFields(win))
        ctx.addIssue({ code: 'custom', path: ['exposedWalls', wi, 'windows', i, field], message });
    } else if (openings > gross) {
      const i = largestIndex(wall.doors, doorAreaFt2);
      const door = wall.doors[i];
      if (!door) return;
      const message = `The windows and doors (${roundHalfUp(openings)} ft²) are larger than the wall (${wallFt2} ft²)`;
      for (const field of sizeFields(door))
        ctx.addIssue({ code: 'custom', path: ['exposedWalls', wi, 'doors', i, field], message });
    }
  });
});

export type RoomInput = z.input<typeof roomInputSchema>;
export type Room = z.output<typeof roomInputSchema>;
