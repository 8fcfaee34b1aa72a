/** The customer's proposal (a proposal-link session): one record per proposal. */
export const customerProposalKeys = {
  all: ['customer-proposal'] as const,
  detail: (proposalId: string) => [...customerProposalKeys.all, proposalId] as const,
};
