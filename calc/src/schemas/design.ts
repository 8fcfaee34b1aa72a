import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';
import { tubeOdSchema } from './equipment';

/** A zone: the rooms one indoor unit serves. */
export const zoneSchema = z.object({
  key: keyField('Zone key'),
  name: nameField('Zone name'),
  roomIds: z
    .array(keyField('Room id'))
    .min(1, 'Choose at least one room for the zone')
    .max(50, 'At most 50 rooms per zone'),
  indoorUnitKey: keyField('Indoor unit'),
});

/** One line-set circuit from the outdoor unit to a zone's indoor unit. Lengths in ft. */
export const circuitSchema = z.object({
  zoneKey: keyField('Zone'),
  lengthFt: bounded('Line-set length', 1, 300, 'ft'),
  liftFt: bounded('Vertical lift', 0, 200, 'ft').default(0),
  liquidOdIn: tubeOdSchema.optional(),
  suctionOdIn: tubeOdSchema.optional(),
  wallPenetrations: boundedInt('Wall penetrations', 0, 6).default(1),
  lineCoverFt: bounded('Line cover length', 0, 300, 'ft').default(0),
  condensate: z.enum(['gravity', 'pump'], { error: 'Choose gravity drain or pump' }).default('gravity'),
  condensateLengthFt: bounded('Condensate line length', 0, 200, 'ft').default(10),
});

/** The branch circuit feeding an outdoor unit. */
export const electricalInputSchema = z.object({
  terminationC: z
    .union([z.literal(60), z.literal(75)], { error: 'Termination rating must be 60 or 75 °C' })
    .default(60),
  wiringMethod: z.enum(['nm-b', 'thhn-conduit', 'uf-b'], { error: 'Choose a wiring method' }).default('nm-b'),
  circuitLengthFt: bounded('Circuit length', 1, 300, 'ft'),
  disconnectDistanceFt: bounded('Disconnect distance', 0, 500, 'ft').default(5),
  disconnectVisible: z.boolean().default(true),
});

/** One outdoor unit and what it feeds. */
export const systemSchema = z.object({
  key: keyField('System key'),
  name: nameField('System name'),
  outdoorUnitKey: keyField('Outdoor unit'),
  mounting: z.enum(['pad', 'wall-bracket'], { error: 'Choose pad or wall bracket' }).default('pad'),
  circuits: z.array(circuitSchema).min(1, 'Add at least one line-set circuit').max(8, 'At most 8 circuits per system'),
  electrical: electricalInputSchema,
});

/** The design: zones and systems. */
export const designSchema = z.object({
  zones: z.array(zoneSchema).min(1, 'Add at least one zone').max(40, 'At most 40 zones'),
  systems: z.array(systemSchema).min(1, 'Add at least one system').max(10, 'At most 10 systems'),
});

export type Zone = z.output<typeof zoneSchema>;
export type Circuit = z.output<typeof circuitSchema>;
export type CircuitInput = z.input<typeof circuitSchema>;
export type ElectricalInput = z.output<typeof electricalInputSchema>;
export type System = z.output<typeof systemSchema>;
export type DesignInput = z.input<typeof designSchema>;
export type Design = z.output<typeof designSchema>;
