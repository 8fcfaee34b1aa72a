import { jobKeys } from '../../../entities/job/query-keys';

/** The proposal's e-mailed links hang under the job's proposal (office14's `proposalKeys.proposal`), so sending refreshes the trail too. */
export const proposalLinkKeys = {
  proposal: (jobId: string) => [...jobKeys.detail(jobId), 'proposal'] as const,
  links: (jobId: string) => [...proposalLinkKeys.proposal(jobId), 'links'] as const,
};
