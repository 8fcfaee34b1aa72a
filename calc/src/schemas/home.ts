import { z } from 'zod';
import { keyField, nameField } from './fields';
import { designConditionsSchema } from './design-conditions';
import { roomInputSchema } from './room-input';

/** Envelope tightness keys of the construction defaults. */
export const tightnessSchema = z.enum(['very-tight', 'tight', 'average', 'leaky', 'very-leaky'], {
  error: 'Choose how tight the house is',
});

/** A home: its design conditions, its tightness and its rooms (unique ids). */
export const homeInputSchema = z
  .object({
    id: keyField('Home id').optional(),
    name: nameField('Home name').optional(),
    designConditions: designConditionsSchema,
    tightness: tightnessSchema.default('average'),
    rooms: z.array(roomInputSchema).min(1, 'Add at least one room').max(200, 'At most 200 rooms'),
  })
  .superRefine((home, ctx) => {
    const seen = new Set<string>();
    home.rooms.forEach((room, i) => {
      if (seen.has(room.id))
        ctx.addIssue({ code: 'custom', path: ['rooms', i, 'id'], message: 'Each room needs its own id' });
      seen.add(room.id);
    });
  });

export type HomeInput = z.input<typeof homeInputSchema>;
export type Home = z.output<typeof homeInputSchema>;
export type Tightness = z.output<typeof tightnessSchema>;
