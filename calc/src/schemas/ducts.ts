import { z } from 'zod';
import { bounded, keyField } from './fields';
import { surfaceColorSchema } from './room';

/** Where the ducts of a ducted system run. */
export const ductLocationSchema = z.enum(['conditioned', 'attic', 'crawlspace', 'garage', 'basement'], {
  error: 'Choose where the ducts run',
});

/** How tight the ducts are, when no tested leakage fractions are entered. */
export const ductLeakageSchema = z.enum(['sealed', 'typical', 'leaky'], { error: 'Choose how tight the ducts are' });

/**
 * A ducted system's ducts: where they run, their insulation, their leakage and (optionally) their
 * surface areas and the blower airflow. Supply and return run in the same place. `roomIds`, when
 * given, names the rooms the ducted system serves (default: every room of the home).
 */
export const ductSystemSchema = z.object({
  location: ductLocationSchema,
  /** Insulation R-value of the duct wall (0 for bare metal), h·ft²·°F/Btu. */
  insulationR: bounded('Duct insulation', 0, 30, 'R').default(6),
  leakage: ductLeakageSchema.default('typical'),
  /** Tested leakage to outside the conditioned space as a fraction of the blower airflow. */
  supplyLeakageFraction: bounded('Supply duct leakage', 0, 0.5).optional(),
  returnLeakageFraction: bounded('Return duct leakage', 0, 0.5).optional(),
  supplyAreaFt2: bounded('Supply duct surface area', 1, 5000, 'ft²').optional(),
  returnAreaFt2: bounded('Return duct surface area', 1, 5000, 'ft²').optional(),
  airflowCfm: bounded('Blower airflow', 50, 10000, 'cfm').optional(),
  /** For ducts in an attic: the roof colour and a radiant barrier set the attic air temperature. */
  roofColor: surfaceColorSchema.optional(),
  radiantBarrier: z.boolean().optional(),
  roomIds: z.array(keyField('Room id')).max(200, 'At most 200 rooms').optional(),
});

export type DuctLocation = z.output<typeof ductLocationSchema>;
export type DuctLeakage = z.output<typeof ductLeakageSchema>;
export type DuctSystemInput = z.input<typeof ductSystemSchema>;
export type DuctSystem = z.output<typeof ductSystemSchema>;
