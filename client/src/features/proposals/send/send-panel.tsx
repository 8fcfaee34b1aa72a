import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { z } from 'zod';
import { emailRule, PROPOSAL_LINK_DAYS } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { errorMessage } from '../../../lib/api-error';
import { proposalLinksQueryOptions, useRevokeLink, useSendProposal } from './api/links';
import { LinkRow } from './link-row';
import { proposalLinkKeys } from './query-keys';

const sendSchema = z.object({ to: emailRule });

/**
 * "Send to the customer" (issue 14): the current version by e-mail with a link of its own. The recipient is
 * the job's customer's e-mail, editable; each send makes a new link, and earlier links keep working until
 * they expire or are withdrawn. The list shows each link's state from the real mail state ("Waiting to send"
 * until the mail server has taken it).
 */
export function SendPanel({ jobId }: { jobId: string }) {
  const { data } = useSuspenseQuery(proposalLinksQueryOptions(jobId));
  const send = useSendProposal(jobId);
  // "Send again" on a row: its own mutation, so its error shows here and not on the form.
  const resend = useSendProposal(jobId);
  const revoke = useRevokeLink(jobId);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const can = data.canSend;
  // The 'sent' event is written when the mail server takes the e-mail: when the poll sees a link go out,
  // the screen's audit trail is read again too.
  const queryClient = useQueryClient();
  const sentCount = data.links.filter((l) => l.sentAt !== null).length;
  const seen = useRef(sentCount);
  useEffect(() => {
    if (sentCount === seen.current) return;
    seen.current = sentCount;
    void queryClient.invalidateQueries({ queryKey: proposalLinkKeys.proposal(jobId), exact: true });
  }, [sentCount, jobId, queryClient]);
  return (
    <section aria-labelledby="send-heading" className="rounded-lg border border-line bg-white p-4 shadow-card sm:p-6">
      <h2 id="send-heading" className="text-lg font-semibold text-ink-900">
        Send to the customer
      </h2>
      {can.ok ? (
        <>
          <p className="mt-1 text-base text-muted">
            Version {can.versionNumber} goes by e-mail with a link only for this proposal, working for{' '}
            {PROPOSAL_LINK_DAYS} days. Sending again makes a new link; earlier ones work until withdrawn or expired.
          </p>
          <Form
            className="mt-3"
            schema={sendSchema}
            defaultValues={{ to: data.customerEmail ?? '' }}
            aria-label="Send the proposal"
            onSubmit={async ({ to }) => {
              setSentTo(null);
              await send.mutateAsync(to);
              setSentTo(to);
            }}
          >
            <TextField name="to" label="Customer’s e-mail" type="email" inputMode="email" autoComplete="off" />
            <div>
              <SubmitButton>Send version {can.versionNumber}</SubmitButton>
            </div>
          </Form>
        </>
      ) : (
        <div className="mt-2">
          <Alert tone="info" title="Not ready to send">
            {can.reason}
          </Alert>
        </div>
      )}
      {sentTo ? (
        <div className="mt-3">
          <Alert tone="ok" title={`On its way to ${sentTo}.`}>
            The list below says when the mail server has taken it.
          </Alert>
        </div>
      ) : null}
      {resend.isError ? (
        <div className="mt-3">
          <Alert tone="danger" title="Not sent again">
            {errorMessage(resend.error)}
          </Alert>
        </div>
      ) : null}
      {revoke.isError ? (
        <div className="mt-3">
          <Alert tone="danger" title="The link was not withdrawn">
            {errorMessage(revoke.error)}
          </Alert>
        </div>
      ) : null}
      {data.links.length ? (
        <>
          <h3 className="mt-5 text-base font-semibold text-ink-900">Links sent</h3>
          <ul className="mt-2 flex flex-col gap-2" aria-label="Links sent">
            {data.links.map((link) => (
              <LinkRow
                key={link.id}
                link={link}
                canResend={can.ok && link.versionNumber === can.versionNumber}
                busy={
                  (revoke.isPending && revoke.variables === link.id) ||
                  (resend.isPending && resend.variables === link.to)
                }
                onRevoke={() => revoke.mutate(link.id)}
                onResend={() => resend.mutate(link.to, { onSuccess: () => setSentTo(link.to) })}
              />
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}
