import { z } from 'zod';
import { bounded, boundedInt, compassDirectionSchema, nameField } from './fields';

/** Interior shading of a window. */
export const interiorShadingSchema = z.enum(['none', 'blinds', 'drapes', 'shades'], {
  error: 'Choose the interior shading',
});
/** Glazing type keys of the construction defaults. */
export const glazingTypeSchema = z.enum(['single-clear', 'double-clear', 'double-low-e', 'triple-low-e'], {
  error: 'Choose a glazing type',
});
/** Wall construction keys of the construction defaults. */
export const wallConstructionSchema = z.enum(
  ['wood-2x4-r13', 'wood-2x6-r19', 'wood-2x4-uninsulated', 'masonry-uninsulated', 'masonry-r10-furred'],
  { error: 'Choose a wall construction' },
);
export const doorTypeSchema = z.enum(['wood-solid', 'insulated-steel', 'fiberglass'], { error: 'Choose a door type' });
export const ceilingInsulationSchema = z.enum(['none', 'r11', 'r19', 'r30', 'r38', 'r49', 'r60'], {
  error: 'Choose an insulation level',
});
/** Outside colour of a wall or roof (sets the solar absorptance for sol-air). */
export const surfaceColorSchema = z.enum(['light', 'medium', 'dark'], { error: 'Choose light, medium or dark' });
export const floorInsulationSchema = z.enum(['none', 'r13', 'r19', 'r30'], { error: 'Choose an insulation level' });

/** A window (or a group of `count` equal windows): width × height in inches, or an area in ft². */
export const windowSchema = z
  .object({
    widthIn: bounded('Window width', 6, 240, 'in').optional(),
    heightIn: bounded('Window height', 6, 144, 'in').optional(),
    areaFt2: bounded('Window area', 0.5, 300, 'ft²').optional(),
    count: boundedInt('Window count', 1, 20).default(1),
    glazing: glazingTypeSchema.default('double-clear'),
    uFactor: bounded('Window U-factor', 0.1, 1.5, 'Btu/h·ft²·°F').optional(),
    shgc: bounded('Window SHGC', 0.05, 0.9).optional(),
    interiorShading: interiorShadingSchema.default('none'),
    /** Exterior overhang over the window: how far it sticks out, and its height above the window top. */
    overhangDepthFt: bounded('Overhang depth', 0, 20, 'ft').optional(),
    overhangGapFt: bounded('Overhang height above the window', 0, 20, 'ft').optional(),
  })
  .refine((w) => w.areaFt2 !== undefined || (w.widthIn !== undefined && w.heightIn !== undefined), {
    message: 'Enter the window width and height, or its area',
    path: ['areaFt2'],
  });

/** A door on an exposed wall: width × height in inches, or area in ft². */
export const doorSchema = z
  .object({
    widthIn: bounded('Door width', 18, 144, 'in').optional(),
    heightIn: bounded('Door height', 60, 120, 'in').optional(),
    areaFt2: bounded('Door area', 5, 100, 'ft²').optional(),
    count: boundedInt('Door count', 1, 6).default(1),
    doorType: doorTypeSchema.default('insulated-steel'),
    uFactor: bounded('Door U-factor', 0.05, 1.2, 'Btu/h·ft²·°F').optional(),
  })
  .refine((d) => d.areaFt2 !== undefined || (d.widthIn !== undefined && d.heightIn !== undefined), {
    message: 'Enter the door width and height, or its area',
    path: ['areaFt2'],
  });

/** An exterior (exposed) wall with its windows and doors. Height defaults to the room's ceiling height. */
export const wallSchema = z.object({
  direction: compassDirectionSchema,
  lengthFt: bounded('Wall length', 1, 200, 'ft'),
  heightFt: bounded('Wall height', 2, 40, 'ft').optional(),
  construction: wallConstructionSchema.default('wood-2x4-r13'),
  uFactor: bounded('Wall U-factor', 0.01, 1, 'Btu/h·ft²·°F').optional(),
  color: surfaceColorSchema.optional(),
  /** How much of the wall's height is below grade (a basement wall); windows and doors sit above grade. */
  belowGradeFt: bounded('Depth below grade', 0, 20, 'ft').optional(),
  windows: z.array(windowSchema).max(20, 'At most 20 window entries per wall').default([]),
  doors: z.array(doorSchema).max(6, 'At most 6 door entries per wall').default([]),
});

/** What is above the room. */
export const aboveSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('attic'),
      insulation: ceilingInsulationSchema.default('r30'),
      roofColor: surfaceColorSchema.optional(),
      radiantBarrier: z.boolean().optional(),
    }),
    z.object({
      kind: z.literal('roof'),
      insulation: ceilingInsulationSchema.default('r30'),
      roofColor: surfaceColorSchema.optional(),
    }),
    z.object({ kind: z.literal('conditioned') }),
  ],
  { error: 'Choose what is above the room' },
);

/** What is below the room. */
export const belowSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('slab'), edgeInsulated: z.boolean().default(false) }),
    z.object({
      kind: z.literal('crawlspace'),
      vented: z.boolean().default(true),
      insulation: floorInsulationSchema.default('none'),
    }),
    z.object({ kind: z.literal('basement'), insulation: floorInsulationSchema.default('none') }),
    /** The room is in a basement: its floor is a slab `depthFt` below grade. */
    z.object({
      kind: z.literal('basement-floor'),
      depthFt: bounded('Floor depth below grade', 1, 20, 'ft'),
      /** Shortest width of the whole basement; default the room's shorter side. */
      widthFt: bounded('Basement width', 4, 200, 'ft').optional(),
      insulationR: bounded('Floor insulation', 0, 30, 'R').default(0),
    }),
    z.object({ kind: z.literal('garage'), insulation: floorInsulationSchema.default('none') }),
    z.object({ kind: z.literal('conditioned') }),
  ],
  { error: 'Choose what is below the room' },
);

/** A heat-producing appliance or light: a gain in W or Btu/h, plus optional latent Btu/h. */
export const applianceSchema = z.object({
  label: nameField('Appliance name', 60),
  gain: bounded('Appliance gain', 0, 20000),
  unit: z.enum(['W', 'Btu/h'], { error: 'Choose W or Btu/h' }).default('W'),
  latentBtuh: bounded('Appliance latent gain', 0, 10000, 'Btu/h').default(0),
});

export type WindowInput = z.input<typeof windowSchema>;
export type Window = z.output<typeof windowSchema>;
export type DoorInput = z.input<typeof doorSchema>;
export type Door = z.output<typeof doorSchema>;
export type WallInput = z.input<typeof wallSchema>;
export type Wall = z.output<typeof wallSchema>;
export type Above = z.output<typeof aboveSchema>;
export type Below = z.output<typeof belowSchema>;
export type Appliance = z.output<typeof applianceSchema>;
export type SurfaceColor = z.output<typeof surfaceColorSchema>;
