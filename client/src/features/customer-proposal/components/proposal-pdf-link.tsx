import { buttonClass } from '../../../components/ui/button';
import { customerProposalApiPath } from '../api/get-customer-proposal';

/** Download the PDF (a plain link: the browser saves the file; the server records the download). */
export function ProposalPdfLink({ proposalId, ready }: { proposalId: string; ready: boolean }) {
  if (!ready)
    return (
      <p className="text-base text-muted" role="status">
        The PDF copy is still being prepared. Reload this page in a minute to download it.
      </p>
    );
  return (
    <a
      className={buttonClass('secondary', 'w-full sm:w-auto')}
      href={`${customerProposalApiPath(proposalId)}/pdf`}
      download
    >
      Download the proposal (PDF)
    </a>
  );
}
