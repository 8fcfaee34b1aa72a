import { z } from 'zod';
import { designConditionsSchema } from '@calc';
import { UNIT_SYSTEMS } from '@contract';

/** The whole settings document; the owner sends it back with If-Match. */
export const putCompanySettingsSchema = z.strictObject({
  unitSystem: z.enum(UNIT_SYSTEMS, { message: 'Unit system must be imperial or metric.' }),
  defaultDesignConditions: designConditionsSchema.strict().nullable(),
});

export type PutCompanySettingsInput = z.output<typeof putCompanySettingsSchema>;
