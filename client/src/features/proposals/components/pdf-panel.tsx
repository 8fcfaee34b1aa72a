import type { ProposalVersionRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClass } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { pdfPath, signedPdfPath } from '../api/get-proposal';
import { formatStamp } from '../model/dates';
import { useRetryPdf } from '../api/retry-pdf';

/**
 * One version's PDF as the queue has it: waiting or being made (the page asks again every two seconds), ready
 * (a preview in a frame — the PDF route lets the app frame it — and a download), or failed (why, and "Try
 * again"). Only the office opens the PDF; a salesperson reads its state.
 */
export function PdfPanel({
  jobId,
  version,
  failure,
  canOpen,
}: {
  jobId: string;
  version: ProposalVersionRecord;
  failure: string | null;
  canOpen: boolean;
}) {
  const retry = useRetryPdf(jobId);
  const n = version.number;
  const state = version.pdf.state;
  return (
    <section aria-labelledby="pdf-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
      <h2 id="pdf-heading" className="text-lg font-semibold text-ink-900">
        PDF of version {n}
      </h2>
      {state === 'waiting' || state === 'rendering' ? (
        <div role="status" className="flex items-center gap-3 text-base text-ink-950">
          <span
            aria-hidden="true"
            className="size-5 shrink-0 animate-spin rounded-full border-2 border-ink-500 border-r-transparent"
          />
          <span>
            {state === 'waiting'
              ? 'Waiting its turn to be made. This page checks again every few seconds.'
              : 'Being made now. The preview appears here when it is ready.'}
          </span>
        </div>
      ) : null}
      {state === 'failed' ? (
        <Alert tone="danger" title="The PDF could not be made.">
          <p>{failure ? `Why: ${failure}` : 'No reason was recorded.'}</p>
          {canOpen ? (
            <>
              <p className="mt-1">It is made again when you press “Try again”; the version itself is kept as issued.</p>
              <Button className="mt-2" variant="secondary" busy={retry.isPending} onClick={() => retry.mutate(n)}>
                Try again
              </Button>
            </>
          ) : (
            <p className="mt-1">The office can have it made again.</p>
          )}
          {retry.isError ? <p className="mt-2 font-semibold">{errorMessage(retry.error)}</p> : null}
        </Alert>
      ) : null}
      {version.signed && canOpen ? (
        <div className="flex flex-col gap-2 rounded-md border border-ok bg-ok-soft p-3 text-base text-ink-950">
          <p>
            <span className="font-semibold">Signed by {version.signed.signerName}</span> on{' '}
            {formatStamp(version.signed.at)}.
          </p>
          {version.signed.copySha256 ? (
            <>
              <a className={`${buttonClass('primary')} self-start`} href={signedPdfPath(jobId, n)} download>
                Download the signed copy
              </a>
              <p className="break-all text-sm text-muted">SHA-256 of the signed copy: {version.signed.copySha256}</p>
            </>
          ) : (
            <p role="status">The sealed signed copy is being made. This page checks again every few seconds.</p>
          )}
        </div>
      ) : null}
      {state === 'ready' && canOpen ? (
        <>
          <div className="flex flex-wrap gap-2">
            <a className={buttonClass('primary')} href={pdfPath(jobId, n, true)} download>
              Download the PDF
            </a>
            <a className={buttonClass('secondary')} href={pdfPath(jobId, n)} target="_blank" rel="noopener">
              Open in a new tab
            </a>
          </div>
          {/* A phone's browser shows no PDF in a frame: there the buttons above open it. */}
          <iframe
            title={`Proposal version ${n}, PDF preview`}
            src={pdfPath(jobId, n)}
            className="hidden h-[80vh] min-h-[480px] w-full rounded-md border border-line sm:block"
          />
          {version.pdf.sha256 ? (
            <p className="break-all text-sm text-muted">SHA-256 of this PDF: {version.pdf.sha256}</p>
          ) : null}
        </>
      ) : null}
      {state === 'ready' && !canOpen ? (
        <p className="text-base text-ink-950">The PDF is ready. The office previews and downloads it.</p>
      ) : null}
    </section>
  );
}
