import { z } from 'zod';
import { customerFields, siteFields } from '../../lib/job-fields';
import { customerRecord, customerResponse, JOB_STATUSES, jobRecord, type CustomerRecord } from '../../lib/job-records';

/** Client copies of the server's customer and job records and the new-job form (rules in lib/job-fields.ts). */
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
    ...customerFields,
    ...siteFields,
  })
  .superRefine((v, ctx) => {
    if (v.customerMode === 'new' && v.customerName.trim() === '')
      ctx.addIssue({ code: 'custom', path: ['customerName'], message: 'Enter the customer name.' });
    if (v.customerMode === 'existing' && v.customerId === '')
      ctx.addIssue({ code: 'custom', path: ['customerId'], message: 'Choose a customer.' });
  });
export type NewJobInput = z.input<typeof newJobSchema>;
export type NewJobValues = z.output<typeof newJobSchema>;

export { customerRecord, customerResponse, JOB_STATUSES, type CustomerRecord };
