import { z } from 'zod';
import { userRules } from '@contract';

export const createUserSchema = z.object(userRules);
export type CreateUserInput = z.infer<typeof createUserSchema>;

export interface UpdateUserInput {
  name?: string;
  role?: CreateUserInput['role'];
  active?: boolean;
}
