import { ProposalPage } from '../../features/proposals/components/proposal-page';

/** /jobs/:jobId/proposal — the office's proposal screen; loader: app/job-proposal-loader.ts. */
export default function JobProposalRoute() {
  return <ProposalPage />;
}
