import { z } from 'zod';
import { emailSchema, newPasswordSchema } from '../auth/auth.schema';
import { ROLES } from './user.entity';

const nameSchema = z
  .string({ message: 'Enter a name.' })
  .trim()
  .min(1, { message: 'Enter a name.' })
  .max(120, { message: 'Name must be at most 120 characters.' });
const roleSchema = z.enum(ROLES, { message: `Role must be one of: ${ROLES.join(', ')}.` });

export const createUserSchema = z.strictObject({
  name: nameSchema,
  email: emailSchema,
  role: roleSchema,
  password: newPasswordSchema,
});

export const updateUserSchema = z
  .strictObject({
    name: nameSchema.optional(),
    role: roleSchema.optional(),
    active: z.boolean({ message: 'Active must be true or false.' }).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one of name, role or active.' });

export const userIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a user id.' }) });

export type CreateUserInput = z.infer<typeof createUserSchema>;
export type UpdateUserInput = z.infer<typeof updateUserSchema>;
