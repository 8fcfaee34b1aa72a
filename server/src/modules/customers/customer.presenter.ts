import type { CustomerRecord } from '@contract';
import { presentLastChange } from '../../lib/change-stamp';
import type { Customer } from './customer.entity';

/** The only shape a customer leaves the server in. */
export function presentCustomer(c: Customer): CustomerRecord {
  return {
    id: c.id,
    name: c.name,
    email: c.email ?? null,
    phone: c.phone ?? null,
    notes: c.notes,
    version: c.version,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
    lastChange: presentLastChange(c),
  };
}
