import { useSuspenseQuery } from '@tanstack/react-query';
import { Suspense, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { z } from 'zod';
import { mayIssueProposal, mayOpenProposalPdf, mayReadProposal } from '@contract';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { Alert } from '../../../components/ui/alert';
import { buttonClass } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { jobStatusText } from '../../../entities/job/labels';
import { jobPaths } from '../../../entities/job/paths';
import { jobQueryOptions } from '../../../entities/job/queries';
import { useViewer, type Viewer } from '../../../lib/viewer';
import { proposalQueryOptions } from '../api/get-proposal';
import { pdfFailure } from '../model/event-words';
import { AuditTrail } from './audit-trail';
import { IssuePanel } from './issue-panel';
import { PdfPanel } from './pdf-panel';
import { VersionsList } from './versions-list';
import { WhatChanged } from './what-changed';
import { SendPanel } from '../send/send-panel';

/** A panel of the left-hand column from lg (one column on a phone). */
const LEFT = 'min-w-0 lg:col-start-1';

export const proposalParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/**
 * /jobs/:jobId/proposal — the office's proposal screen: issue version N, the versions with their PDFs (progress,
 * preview, download), what changed between any two, and the audit trail in order. A salesperson reads their own
 * job's proposal; issuing and the PDF are the office's.
 */
export function ProposalPage() {
  const { jobId } = proposalParams.parse(useParams());
  const viewer = useViewer();
  if (!viewer) return null;
  if (!mayReadProposal(viewer.role))
    return (
      <Alert tone="warning" title="Proposals are for the office and the job’s salesperson.">
        <Link className="underline" to={jobPaths.walkthrough(jobId)}>
          The job page
        </Link>{' '}
        has what you need for the install.
      </Alert>
    );
  return <ProposalScreen jobId={jobId} viewer={viewer} />;
}

function ProposalScreen({ jobId, viewer }: { jobId: string; viewer: Viewer }) {
  const job = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const data = useSuspenseQuery(proposalQueryOptions(jobId)).data;
  const [picked, setPicked] = useState<number | null>(null);
  const proposal = data.proposal;
  const versions = proposal?.versions ?? [];
  const shown = versions.find((v) => v.number === picked) ?? versions.find((v) => v.current) ?? versions[0] ?? null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={`Proposal — ${job.customer.name}`}
        lead={`${[job.site.street, job.site.city].filter(Boolean).join(', ')} · ${jobStatusText(job)}`}
        actions={
          <div className="flex flex-wrap gap-2">
            <Link className={buttonClass('secondary')} to={jobPaths.walkthrough(jobId)}>
              The job
            </Link>
            <Link className={buttonClass('secondary')} to={jobPaths.desk(jobId)}>
              Options and price
            </Link>
          </div>
        }
      />
      {/*
        One column on a phone, in the order a person there needs it (the DOM order, so a screen reader and the
        keyboard go the same way): issue, the versions, the shown version's PDF, sending it, then what changed and
        the audit trail last. From lg the PDF takes the right-hand column across every row; the rest stacks on
        the left, and the last, flexible row takes up whatever the PDF is taller by, so no gap opens between
        the left-hand panels.
      */}
      <div className="flex flex-col gap-6 lg:grid lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)] lg:grid-rows-[repeat(5,auto)_1fr] lg:items-start">
        {mayIssueProposal(viewer.role) ? (
          <div className={LEFT}>
            <IssuePanel jobId={jobId} data={data} readyAt={job.readyToProposeAt ?? null} />
          </div>
        ) : null}
        {proposal && shown ? (
          <>
            <div className={LEFT}>
              <VersionsList versions={versions} shown={shown.number} onShow={setPicked} />
            </div>
            <div className="min-w-0 lg:col-start-2 lg:row-[1/-1]">
              <PdfPanel
                jobId={jobId}
                version={shown}
                failure={pdfFailure(proposal.events, shown.number)}
                canOpen={mayOpenProposalPdf(viewer.role)}
              />
            </div>
            {/* "Send to the customer" (send14's panel, features/proposals/send/): the office's only. */}
            {mayIssueProposal(viewer.role) ? (
              <div className={LEFT}>
                <QueryWidgetBoundary name="sending to the customer">
                  <Suspense fallback={<Spinner label="Loading the links sent…" />}>
                    <SendPanel jobId={jobId} />
                  </Suspense>
                </QueryWidgetBoundary>
              </div>
            ) : null}
            <div className={LEFT}>
              <WhatChanged jobId={jobId} versions={versions} />
            </div>
            <div className={LEFT}>
              <AuditTrail events={proposal.events} />
            </div>
          </>
        ) : (
          <div className={LEFT}>
            <EmptyState title="No version issued yet">
              {mayIssueProposal(viewer.role)
                ? 'Once the desk marks the job ready to propose, issue version 1 here.'
                : 'The office issues the proposal once the job is ready to propose.'}
            </EmptyState>
          </div>
        )}
      </div>
    </div>
  );
}
