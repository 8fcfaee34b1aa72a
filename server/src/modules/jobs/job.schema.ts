import { z } from 'zod';
import { designNotesSchema, enteredDesignSchema } from './design-conditions';
import { JOB_STATUSES, TIGHTNESS } from './job.entity';

const text = (label: string, max: number) =>
  z
    .string({ message: `Enter the ${label}.` })
    .trim()
    .min(1, { message: `Enter the ${label}.` })
    .max(max, { message: `The ${label} must be at most ${max} characters.` });

const fields = {
  customerId: z.uuid({ message: 'Choose a customer.' }),
  street: text('street address', 200),
  unit: z
    .string({ message: 'The unit must be text.' })
    .trim()
    .max(60, { message: 'The unit must be at most 60 characters.' }),
  city: text('city or town', 100),
  region: text('state or region', 60),
  postalCode: z
    .string({ message: 'Enter the postal code.' })
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 -]{1,18}$/, { message: 'Enter a postal code (letters, digits, spaces or dashes).' }),
  notes: z.string({ message: 'Notes must be text.' }).max(4000, { message: 'Notes must be at most 4000 characters.' }),
  salespersonId: z.uuid({ message: 'Choose a salesperson.' }),
  assignedInstallerId: z.uuid({ message: 'Choose an installer.' }).nullable(),
  tightness: z.enum(TIGHTNESS, { message: `Tightness must be one of: ${TIGHTNESS.join(', ')}.` }),
  /** Entered values only; a field left out takes the company default (see design-conditions.ts). */
  designConditions: enteredDesignSchema,
  designSourceNotes: designNotesSchema,
};

export const createJobSchema = z.strictObject({
  ...fields,
  unit: fields.unit.optional(),
  notes: fields.notes.optional(),
  salespersonId: fields.salespersonId.optional(),
  assignedInstallerId: fields.assignedInstallerId.optional(),
  tightness: fields.tightness.optional(),
  designConditions: fields.designConditions.optional(),
  designSourceNotes: fields.designSourceNotes.optional(),
});

export const updateJobSchema = z
  .strictObject({
    ...fields,
    status: z.enum(JOB_STATUSES, { message: `Status must be one of: ${JOB_STATUSES.join(', ')}.` }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' });

export const jobIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a job id.' }) });

export const listJobsQuery = z.strictObject({
  search: z.string().trim().max(100, { message: 'Search must be at most 100 characters.' }).optional(),
  status: z.enum(JOB_STATUSES, { message: `Status must be one of: ${JOB_STATUSES.join(', ')}.` }).optional(),
  page: z.coerce
    .number({ message: 'Page must be a number.' })
    .int({ message: 'Page must be a whole number.' })
    .min(1, { message: 'Page starts at 1.' })
    .max(100_000, { message: 'Page is too large.' })
    .default(1),
  pageSize: z.coerce
    .number({ message: 'Page size must be a number.' })
    .int({ message: 'Page size must be a whole number.' })
    .min(1, { message: 'Page size must be between 1 and 100.' })
    .max(100, { message: 'Page size must be between 1 and 100.' })
    .default(25),
});

export type CreateJobInput = z.output<typeof createJobSchema>;
export type UpdateJobInput = z.output<typeof updateJobSchema>;
export type ListJobsQuery = z.output<typeof listJobsQuery>;
