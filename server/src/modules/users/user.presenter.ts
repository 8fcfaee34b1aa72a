import type { UserRecord } from '@contract';
import type { User } from './user.entity';

/** The only shape a user leaves the server in. */
export function presentUser(u: User): UserRecord {
  return {
    id: u.id,
    name: u.name,
    email: u.email,
    role: u.role,
    active: u.active,
    companyId: u.company.id,
    createdAt: u.createdAt.toISOString(),
  };
}
