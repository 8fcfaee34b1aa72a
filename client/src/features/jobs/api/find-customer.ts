import type { CustomerRecord, JobRecord } from '@contract';
import { getJobs } from './get-jobs';
import { getCustomers } from './get-customers';

const digits = (s: string | null | undefined) => (s ?? '').replace(/\D/g, '');

/**
 * A customer of the company who already has this e-mail (any case) or phone (same digits):
 * before a second one is made, the person is asked whether they meant that one.
 */
export async function findSameCustomer(email: string, phone: string): Promise<CustomerRecord | null> {
  const mail = email.trim().toLowerCase();
  const tel = digits(phone);
  for (const search of [mail, phone.trim()].filter((s) => s.length >= 3)) {
    const found = (await getCustomers(search)).find(
      (c) => (mail !== '' && c.email?.toLowerCase() === mail) || (tel.length >= 7 && digits(c.phone) === tel),
    );
    if (found) return found;
  }
  return null;
}

/** The site of the customer's most recently active job, to start a new job there (editable). */
export async function lastSiteOf(customer: Pick<CustomerRecord, 'id' | 'name'>): Promise<JobRecord['site'] | null> {
  const { items } = await getJobs({ search: customer.name, status: '', page: 1, pageSize: 50 });
  return items.find((j) => j.customer.id === customer.id)?.site ?? null;
}
