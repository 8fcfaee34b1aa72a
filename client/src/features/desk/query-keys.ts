import { jobKeys } from '../../entities/job/query-keys';

/** The desk's keys: a job's options hang under the job (dropping the job drops them); the catalog is the company's. */
export const deskKeys = {
  desk: (jobId: string) => [...jobKeys.detail(jobId), 'desk'] as const,
  models: () => ['company-data', 'models', 'desk'] as const,
  financing: () => ['company-data', 'financing', 'desk'] as const,
};
