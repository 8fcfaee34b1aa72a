import { z } from 'zod';
import { ROLES, UNIT_SYSTEMS } from '@contract';

/** Shapes several features read (the server's presenters are the source of truth for them). */
export const userSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  active: z.boolean(),
  companyId: z.string(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const companySchema = z.object({
  id: z.string(),
  name: z.string(),
  unitSystem: z.enum(UNIT_SYSTEMS),
});
export type Company = z.infer<typeof companySchema>;
