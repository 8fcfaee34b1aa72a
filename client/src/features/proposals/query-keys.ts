import { jobKeys } from '../../entities/job/query-keys';

/** The proposal's keys hang under the job (dropping the job drops them). */
export const proposalKeys = {
  proposal: (jobId: string) => [...jobKeys.detail(jobId), 'proposal'] as const,
  diff: (jobId: string, from: number, to: number) => [...proposalKeys.proposal(jobId), 'diff', from, to] as const,
};
