import { z } from 'zod';
import { customerRules, listQueryFields } from '@contract';

const { name, email, phone, notes } = customerRules;

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
  ...listQueryFields,
});

export type CreateCustomerInput = z.output<typeof createCustomerSchema>;
export type UpdateCustomerInput = z.output<typeof updateCustomerSchema>;
export type ListCustomersQuery = z.output<typeof listCustomersQuery>;

/** For ILIKE: the search is text, never a pattern. */
export const likePattern = (s: string): string => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
