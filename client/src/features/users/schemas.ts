import { z } from 'zod';
import { ROLES } from '../../config/roles';
import { userSchema } from '../../types/user';

// Same rules and wording as the server's user.schema.ts (client never imports server code).
const nameSchema = z
  .string()
  .trim()
  .min(1, { message: 'Enter a name.' })
  .max(120, { message: 'Name must be at most 120 characters.' });

export const createUserSchema = z.object({
  name: nameSchema,
  email: z
    .string()
    .trim()
    .min(1, { message: 'Enter an e-mail address.' })
    .max(254, { message: 'E-mail must be at most 254 characters.' })
    .pipe(z.email({ message: 'Enter a valid e-mail address.' })),
  role: z.enum(ROLES, { message: `Role must be one of: ${ROLES.join(', ')}.` }),
  password: z
    .string()
    .refine((p) => [...p].length >= 12, { message: 'Password must be at least 12 characters.' })
    .refine((p) => [...p].length <= 128, { message: 'Password must be at most 128 characters.' }),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

export interface UpdateUserInput {
  name?: string;
  role?: CreateUserInput['role'];
  active?: boolean;
}

export const usersResponse = z.object({ users: z.array(userSchema) });
export const userResponse = z.object({ user: userSchema });
