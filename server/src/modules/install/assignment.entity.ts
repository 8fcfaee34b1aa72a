import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CompanySchema } from '../companies/company.entity';
import { JobSchema } from '../jobs/job.entity';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/**
 * An installer scheduled on a won job for a day (issue 15; migration …060000_job_assignment). Unique per
 * (job, installer); the office replaces a job's set as a whole.
 */
export const JobAssignmentSchema = defineEntity({
  name: 'JobAssignment',
  tableName: 'job_assignment',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema),
    job: p.manyToOne(JobSchema),
    user: p.manyToOne(UserSchema),
    /** The day they work it, 'YYYY-MM-DD' (a date without a time zone: the site's day). */
    day: p.string().columnType('date'),
    createdBy: p.manyToOne(UserSchema).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type JobAssignment = InferEntity<typeof JobAssignmentSchema>;
