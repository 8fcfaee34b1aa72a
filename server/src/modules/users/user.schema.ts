import { z } from 'zod';
import { userRules } from '@contract';

export const createUserSchema = z.strictObject(userRules);

export const updateUserSchema = z
  .strictObject({
    name: userRules.name.optional(),
    role: userRules.role.optional(),
    active: z.boolean({ message: 'Active must be true or false.' }).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one of name, role or active.' });

export const userIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a user id.' }) });

export type CreateUserInput = z.infer<typeof createUserSchema>;
export type UpdateUserInput = z.infer<typeof updateUserSchema>;
