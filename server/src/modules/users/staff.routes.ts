import type { EntityManager } from '@mikro-orm/postgresql';
import { staffResponse, type StaffMember } from '@contract';
import { OFFICE, type Actor, type ApiRouter } from '../../lib/route';
import { UserSchema } from './user.entity';

/**
 * The people a job can be handed to (its salesperson, its installer): names and roles only,
 * for the owner and estimator who assign them. The full user admin stays owner-only.
 */
export async function listAssignableStaff(em: EntityManager, actor: Actor): Promise<StaffMember[]> {
  const users = await em.find(
    UserSchema,
    { company: actor.companyId, active: true },
    { orderBy: { name: 'asc', id: 'asc' } },
  );
  return users.map((u) => ({ id: u.id, name: u.name, role: u.role }));
}

export function staffRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: OFFICE,
    response: staffResponse,
    handler: async ({ em, actor }) => ({ staff: await listAssignableStaff(em, actor) }),
  });
}
