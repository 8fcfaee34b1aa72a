import { Link } from 'react-router-dom';
import { OWNER_ROLES, roleIn, type ProposalResponse } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClass } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { jobPaths } from '../../../entities/job/paths';
import { errorMessage } from '../../../lib/api-error';
import { useViewer } from '../../../lib/viewer';
import { useIssueVersion } from '../api/issue-version';

/**
 * "Issue version N" for the office. The server says whether the job may be issued, why not and where that is
 * put right (`fix`: the desk — not marked ready, what blocks it — or the company settings — no business
 * address for the cancellation notice); the same reasons come back in a 409 if something changed meanwhile.
 * Settings is the owner's page: an estimator gets the words (ask the owner) without a link that would fail.
 */
export function IssuePanel({
  jobId,
  data,
  readyAt,
}: {
  jobId: string;
  data: ProposalResponse;
  /** When the desk last marked the job ready (any change takes the mark off). */
  readyAt: string | null;
}) {
  const issue = useIssueVersion(jobId);
  const viewer = useViewer();
  const mayOpenSettings = viewer !== null && roleIn(OWNER_ROLES, viewer.role);
  const versions = data.proposal?.versions ?? [];
  const current = versions.find((v) => v.current) ?? null;
  const next = (versions[0]?.number ?? 0) + 1;
  // Marked ready before the current version was issued: the desk has not changed since, so issuing again is
  // rarely what is wanted (sending is). Still offered, for a change made outside the desk (terms, details).
  const unchanged = current !== null && readyAt !== null && Date.parse(readyAt) <= Date.parse(current.issuedAt);
  return (
    <section aria-labelledby="issue-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
      <h2 id="issue-heading" className="text-lg font-semibold text-ink-900">
        {data.canIssue.ok || !data.canIssue.signed
          ? current
            ? 'Issue a new version'
            : 'Issue the proposal'
          : 'Signed'}
      </h2>
      {data.canIssue.ok || !data.canIssue.signed ? (
        <p className="max-w-prose text-base text-ink-950">
          Issuing freezes what the desk shows now: the server works every figure out again from the saved rooms and
          options and keeps it unchanged from then on.
          {current
            ? ` Version ${current.number} stays readable and is marked superseded; its link stops working, so send the new one.`
            : ''}
        </p>
      ) : null}
      {data.canIssue.ok ? (
        <div className="flex flex-col gap-2">
          {unchanged && current ? (
            <p className="max-w-prose text-base text-ink-950">
              Nothing on the desk has changed since version {current.number} was issued: send that one. Issue a new
              version after a change on the desk, or to the company’s proposal details.
            </p>
          ) : null}
          <div>
            <Button variant={unchanged ? 'secondary' : 'primary'} busy={issue.isPending} onClick={() => issue.mutate()}>
              Issue version {next}
            </Button>
          </div>
        </div>
      ) : data.canIssue.signed ? (
        // A signed version not cancelled: no new version here, and no way to the desk offered as if there were.
        <Alert tone="info">
          <p>{data.canIssue.reason}</p>
        </Alert>
      ) : (
        <Alert tone="warning" title={`Version ${next} cannot be issued yet.`}>
          <p>{data.canIssue.reason}</p>
          {data.canIssue.fix === 'settings' ? (
            mayOpenSettings ? (
              <Link className={`${buttonClass('secondary')} mt-2`} to={paths.companySettings}>
                Open Settings
              </Link>
            ) : null
          ) : (
            <Link className={`${buttonClass('secondary')} mt-2`} to={jobPaths.desk(jobId)}>
              Open the desk
            </Link>
          )}
        </Alert>
      )}
      {issue.isError ? (
        <Alert tone="danger" title="The version was not issued.">
          {errorMessage(issue.error)}
        </Alert>
      ) : null}
      {issue.isSuccess ? (
        <p role="status" className="font-semibold text-ok">
          Version {issue.data.proposal?.versions[0]?.number} issued.
        </p>
      ) : null}
    </section>
  );
}
