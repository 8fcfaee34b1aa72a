import { z } from 'zod';
import { blankOr, customerRules, siteRules } from '@contract';

/** The new-job form (field rules from the contract; the records it reads are the contract's too). */
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
