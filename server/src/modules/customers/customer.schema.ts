import { z } from 'zod';
import { customerRules, listQueryFields } from '@contract';

const { name, email, phone, notes } = customerRules;

const customerFields = {
  name,
  email: email.nullable().optional(),
  phone: phone.nullable().optional(),
  notes: notes.optional(),
};

/**
 * A new customer. With the e-mail or phone of one the company has, the answer is 409 `duplicate` naming
 * that customer ("Use the existing customer?"); `createAnyway: true` makes the second one all the same.
 */
export const createCustomerSchema = z.strictObject({
  ...customerFields,
  createAnyway: z.boolean({ message: 'createAnyway must be true or false.' }).optional(),
});

export const updateCustomerSchema = z
  .strictObject(customerFields)
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
