import { z } from 'zod';
import { JOB_STATUSES, jobRecord } from '../../lib/job-records';

/** Client copies of the server's customer and job schemas (same bounds, same words). */
const text = (label: string, max: number) =>
  z.string({ message: `Enter the ${label}.` }).trim().min(1, { message: `Enter the ${label}.` }).max(max, { message: `The ${label} must be at most ${max} characters.` });

export const customerRecord = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  notes: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type CustomerRecord = z.output<typeof customerRecord>;

export const customersResponse = z.object({ items: z.array(customerRecord), total: z.number(), page: z.number(), pageSize: z.number() });
export const customerResponse = z.object({ customer: customerRecord });
export const jobsResponse = z.object({ items: z.array(jobRecord), total: z.number(), page: z.number(), pageSize: z.number() });

/** Blank text fields mean "not given"; the server takes null for those. */
const optionalText = (schema: z.ZodType<string>) => z.union([z.literal(''), schema]);

export const newJobSchema = z
  .object({
    customerMode: z.enum(['new', 'existing']),
    customerId: z.string(),
    customerName: z.string().trim().max(160, { message: 'Name must be at most 160 characters.' }),
    customerEmail: optionalText(z.string().trim().toLowerCase().max(254, { message: 'E-mail must be at most 254 characters.' }).pipe(z.email({ message: 'Enter a valid e-mail address.' }))),
    customerPhone: optionalText(z.string().trim().regex(/^\+?[0-9][0-9 ().-]{5,38}$/, { message: 'Enter a phone number using digits, spaces, dashes, dots or brackets.' })),
    street: text('street address', 200),
    unit: z.string().trim().max(60, { message: 'The unit must be at most 60 characters.' }),
    city: text('city or town', 100),
    region: text('state or region', 60),
    postalCode: z.string().trim().regex(/^[A-Za-z0-9][A-Za-z0-9 -]{1,18}$/, { message: 'Enter a postal code (letters, digits, spaces or dashes).' }),
    notes: z.string().max(4000, { message: 'Notes must be at most 4000 characters.' }),
  })
  .superRefine((v, ctx) => {
    if (v.customerMode === 'new' && v.customerName.trim() === '') ctx.addIssue({ code: 'custom', path: ['customerName'], message: 'Enter the customer name.' });
    if (v.customerMode === 'existing' && v.customerId === '') ctx.addIssue({ code: 'custom', path: ['customerId'], message: 'Choose a customer.' });
  });
export type NewJobInput = z.input<typeof newJobSchema>;
export type NewJobValues = z.output<typeof newJobSchema>;

export { JOB_STATUSES };
