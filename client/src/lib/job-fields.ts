import { z } from 'zod';

/**
 * The client's copies of the server's customer and job field rules (customer.schema.ts,
 * job.schema.ts), same bounds and same words, for the new-job form and the job details form.
 */
export const requiredText = (label: string, max: number) =>
  z
    .string({ message: `Enter the ${label}.` })
    .trim()
    .min(1, { message: `Enter the ${label}.` })
    .max(max, { message: `The ${label} must be at most ${max} characters.` });

/** Blank text fields mean "not given"; the server takes null for those. */
const optionalText = (schema: z.ZodType<string>) => z.union([z.literal(''), schema]);

export const customerFields = {
  customerName: z.string().trim().max(160, { message: 'Name must be at most 160 characters.' }),
  customerEmail: optionalText(
    z
      .string()
      .trim()
      .toLowerCase()
      .max(254, { message: 'E-mail must be at most 254 characters.' })
      .pipe(z.email({ message: 'Enter a valid e-mail address.' })),
  ),
  customerPhone: optionalText(
    z
      .string()
      .trim()
      .regex(/^\+?[0-9][0-9 ().-]{5,38}$/, {
        message: 'Enter a phone number using digits, spaces, dashes, dots or brackets.',
      }),
  ),
};

export const siteFields = {
  street: requiredText('street address', 200),
  unit: z.string().trim().max(60, { message: 'The unit must be at most 60 characters.' }),
  city: requiredText('city or town', 100),
  region: requiredText('state or region', 60),
  postalCode: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 -]{1,18}$/, { message: 'Enter a postal code (letters, digits, spaces or dashes).' }),
  notes: z.string().max(4000, { message: 'Notes must be at most 4000 characters.' }),
};
