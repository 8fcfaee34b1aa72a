import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';
import { aboveSchema, applianceSchema, belowSchema, wallSchema } from './room';
import { roundHalfUp } from '../rounding';
import { wallDoorAreaFt2, wallGrossAreaFt2, wallWindowAreaFt2, windowAreaFt2 } from '../geometry';

/**
 * One room as a salesperson enters it on a walk-through. Dimensions in ft; length ×
 * width, or a floor area. Hard bounds here; softer plausibility checks live in
 * `roomPlausibilityWarnings`. A wall's windows and doors may not exceed the wall.
 */
export const roomInputSchema = z
  .object({
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
  })
  .superRefine((room, ctx) => {
    if (room.areaFt2 === undefined && (room.lengthFt === undefined || room.widthFt === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['lengthFt'], message: 'Enter the length and width, or the floor area' });
    }
    room.exposedWalls.forEach((wall, wi) => {
      const gross = wallGrossAreaFt2(wall, room.ceilingHeightFt);
      const windows = wallWindowAreaFt2(wall);
      const openings = windows + wallDoorAreaFt2(wall);
      if (windows > gross) {
        const largest = wall.windows.reduce(
          (best, w, i, all) => (windowAreaFt2(w) > windowAreaFt2(all[best] ?? w) ? i : best),
          0,
        );
        ctx.addIssue({
          code: 'custom',
          path: ['exposedWalls', wi, 'windows', largest, 'areaFt2'],
          message: `The windows (${roundHalfUp(windows)} ft²) are larger than the wall (${roundHalfUp(gross)} ft²)`,
        });
      } else if (openings > gross) {
        ctx.addIssue({
          code: 'custom',
          path: ['exposedWalls', wi, 'doors', 0, 'areaFt2'],
          message: `The windows and doors (${roundHalfUp(openings)} ft²) are larger than the wall (${roundHalfUp(gross)} ft²)`,
        });
      }
    });
  });

export type RoomInput = z.input<typeof roomInputSchema>;
export type Room = z.output<typeof roomInputSchema>;
