import { ConflictError, NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { JobSchema } from '../jobs/job.entity';
import { assertVersion } from '../../lib/version-lock';
import { stampOf } from '../../lib/change-stamp';
import { presentCustomer } from './customer.presenter';
import { CustomerSchema, type Customer } from './customer.entity';
import {
  likePattern,
  type CreateCustomerInput,
  type ListCustomersQuery,
  type UpdateCustomerInput,
} from './customer.schema';

export async function listCustomers(
  { em, actor }: ServiceContext,
  q: ListCustomersQuery,
): Promise<{ items: Customer[]; total: number }> {
  const pat = q.search ? likePattern(q.search) : undefined;
  const where = pat
    ? {
        company: actor.companyId,
        $or: [{ name: { $ilike: pat } }, { email: { $ilike: pat } }, { phone: { $ilike: pat } }],
      }
    : { company: actor.companyId };
  const [items, total] = await em.findAndCount(CustomerSchema, where, {
    orderBy: { name: 'asc', id: 'asc' },
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items, total };
}

export async function getCustomer({ em, actor }: ServiceContext, id: string): Promise<Customer> {
  const c = await em.findOne(CustomerSchema, { id, company: actor.companyId });
  if (!c) throw new NotFoundError('The customer');
  return c;
}

export async function createCustomer({ em, actor }: ServiceContext, input: CreateCustomerInput): Promise<Customer> {
  const c = em.create(CustomerSchema, {
    company: em.getReference(CompanySchema, actor.companyId),
    name: input.name,
    email: input.email ?? null,
    phone: input.phone ?? null,
    notes: input.notes ?? '',
    ...stampOf(actor),
  });
  await em.flush();
  return c;
}

export async function updateCustomer(
  ctx: ServiceContext,
  id: string,
  version: number,
  input: UpdateCustomerInput,
): Promise<Customer> {
  const c = await getCustomer(ctx, id);
  assertVersion(version, c.version, 'The customer', () => presentCustomer(c));
  if (input.name !== undefined) c.name = input.name;
  if (input.email !== undefined) c.email = input.email;
  if (input.phone !== undefined) c.phone = input.phone;
  if (input.notes !== undefined) c.notes = input.notes;
  Object.assign(c, stampOf(ctx.actor));
  await ctx.em.flush();
  return c;
}

/** A customer with jobs stays: the jobs (and later proposals) need who they were for. */
export async function deleteCustomer(ctx: ServiceContext, id: string, version: number): Promise<void> {
  const { em } = ctx;
  const c = await getCustomer(ctx, id);
  assertVersion(version, c.version, 'The customer', () => presentCustomer(c));
  if (await em.count(JobSchema, { customer: c.id }))
    throw new ConflictError('This customer has jobs; it cannot be deleted.');
  em.remove(c);
  await em.flush();
}
