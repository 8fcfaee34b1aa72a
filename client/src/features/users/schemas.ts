import { z } from 'zod';
import { userRules } from '@contract';
import { userSchema } from '../../types/user';

export const createUserSchema = z.object(userRules);
export type CreateUserInput = z.infer<typeof createUserSchema>;

export interface UpdateUserInput {
  name?: string;
  role?: CreateUserInput['role'];
  active?: boolean;
}

export const usersResponse = z.object({ users: z.array(userSchema) });
export const userResponse = z.object({ user: userSchema });
