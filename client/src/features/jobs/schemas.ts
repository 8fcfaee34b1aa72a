import { z } from 'zod';
import { blankOr, customerRules, siteRules } from '@contract';
import { customerRecord, customerResponse, jobRecord, type CustomerRecord } from '../../lib/job-records';

/** The jobs list's records and the new-job form (field rules from the contract). */
export const customersResponse = z.object({
  items: z.array(customerRecord),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export const jobsResponse = z.object({
  items: z.array(jobRecord),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});

export const newJobSchema = z
  .object({
    customerMode: z.enum(['new', 'existing']),
    customerId: z.string(),
    /** Checked with the contract's rule only when a new customer is made (superRefine below). */
    customerName: z.string().trim(),
    customerEmail: blankOr(customerRules.email),
    customerPhone: blankOr(customerRules.phone),
    ...siteRules,
  })
  .superRefine((v, ctx) => {
    if (v.customerMode === 'new')
      for (const i of customerRules.name.safeParse(v.customerName).error?.issues ?? [])
        ctx.addIssue({ code: 'custom', path: ['customerName'], message: i.message });
    if (v.customerMode === 'existing' && v.customerId === '')
      ctx.addIssue({ code: 'custom', path: ['customerId'], message: 'Choose a customer.' });
  });
export type NewJobInput = z.input<typeof newJobSchema>;
export type NewJobValues = z.output<typeof newJobSchema>;

export { customerRecord, customerResponse, type CustomerRecord };
