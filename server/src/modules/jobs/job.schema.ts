import { z } from 'zod';
import {
  designNotesSchema,
  enteredDesignSchema,
  houseInputSchema,
  JOB_STATUSES,
  listQueryFields,
  LOSS_REASON_MAX,
  siteRules,
  TIGHTNESS,
} from '@contract';

const status = z.enum(JOB_STATUSES, { message: `Status must be one of: ${JOB_STATUSES.join(', ')}.` });

const fields = {
  customerId: z.uuid({ message: 'Choose a customer.' }),
  ...siteRules,
  salespersonId: z.uuid({ message: 'Choose a salesperson.' }),
  assignedInstallerId: z.uuid({ message: 'Choose an installer.' }).nullable(),
  tightness: z.enum(TIGHTNESS, { message: `Tightness must be one of: ${TIGHTNESS.join(', ')}.` }),
  /** Entered values only; a field left out takes the company default (see design-conditions.ts). */
  designConditions: enteredDesignSchema,
  designSourceNotes: designNotesSchema,
  house: houseInputSchema,
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
  house: fields.house.optional(),
});

export const updateJobSchema = z
  .strictObject({
    ...fields,
    status,
    /** With status "lost" (or on a lost job): one of the company's loss reasons (GET /api/company/loss-reasons). */
    lostReason: z
      .string({ message: 'Choose why the job was lost.' })
      .trim()
      .min(1, { message: 'Choose why the job was lost.' })
      .max(LOSS_REASON_MAX, { message: `A loss reason is at most ${LOSS_REASON_MAX} characters.` }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' });

export const jobIdParams = z.strictObject({ id: z.uuid({ message: 'Must be a job id.' }) });

export const listJobsQuery = z.strictObject({
  ...listQueryFields,
  status: status.optional(),
});

export type CreateJobInput = z.output<typeof createJobSchema>;
export type UpdateJobInput = z.output<typeof updateJobSchema>;
export type ListJobsQuery = z.output<typeof listJobsQuery>;
