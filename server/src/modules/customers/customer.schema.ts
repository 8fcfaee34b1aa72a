import { z } from 'zod';

const name = z
  .string({ message: 'Enter the customer name.' })
  .trim()
  .min(1, { message: 'Enter the customer name.' })
  .max(160, { message: 'Name must be at most 160 characters.' });
const email = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, { message: 'E-mail must be at most 254 characters.' })
  .pipe(z.email({ message: 'Enter a valid e-mail address.' }));
const phone = z
  .string({ message: 'Enter a phone number.' })
  .trim()
  .regex(/^\+?[0-9][0-9 ().-]{5,38}$/, {
    message: 'Enter a phone number using digits, spaces, dashes, dots or brackets.',
  });
const notes = z
  .string({ message: 'Notes must be text.' })
  .max(4000, { message: 'Notes must be at most 4000 characters.' });

export const createCustomerSchema = z.strictObject({
  name,
  email: email.nullable().optional(),
  phone: phone.nullable().optional(),
  notes: notes.optional(),
});

export const updateCustomerSchema = createCustomerSchema
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' });

export const customerIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a customer id.' }) });

export const listCustomersQuery = z.strictObject({
  search: z.string().trim().max(100, { message: 'Search must be at most 100 characters.' }).optional(),
  page: z.coerce
    .number({ message: 'Page must be a number.' })
    .int({ message: 'Page must be a whole number.' })
    .min(1, { message: 'Page starts at 1.' })
    .max(100_000, { message: 'Page is too large.' })
    .default(1),
  pageSize: z.coerce
    .number({ message: 'Page size must be a number.' })
    .int({ message: 'Page size must be a whole number.' })
    .min(1, { message: 'Page size must be between 1 and 100.' })
    .max(100, { message: 'Page size must be between 1 and 100.' })
    .default(25),
});

export type CreateCustomerInput = z.output<typeof createCustomerSchema>;
export type UpdateCustomerInput = z.output<typeof updateCustomerSchema>;
export type ListCustomersQuery = z.output<typeof listCustomersQuery>;

/** For ILIKE: the search is text, never a pattern. */
export const likePattern = (s: string): string => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
