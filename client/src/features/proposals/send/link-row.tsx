import { useState } from 'react';
import type { ProposalLinkRecord, ProposalLinkState } from '@contract';
import { Button } from '../../../components/ui/button';

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const day = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const at = (iso: string | null) => (iso ? when.format(new Date(iso)) : '');

const STATE: Record<ProposalLinkState, { label: string; className: string }> = {
  'waiting-to-send': { label: 'Waiting to send', className: 'bg-amber-soft text-amber-deep' },
  sent: { label: 'Sent', className: 'bg-ok-soft text-ok' },
  'not-sent': { label: 'Not sent', className: 'bg-danger-soft text-danger' },
  revoked: { label: 'Withdrawn', className: 'bg-ink-50 text-ink-800' },
  expired: { label: 'Expired', className: 'bg-ink-50 text-ink-800' },
  superseded: { label: 'Replaced by a newer version', className: 'bg-ink-50 text-ink-800' },
};

/** What the office needs to know about one link, in a sentence. */
function detail(link: ProposalLinkRecord): string {
  switch (link.state) {
    case 'waiting-to-send':
      return link.mailProblem
        ? `The mail server has not taken it yet: ${link.mailProblem}${link.nextAttemptAt ? ` Next try ${at(link.nextAttemptAt)}.` : ''}`
        : 'In the queue to the mail server.';
    case 'sent':
      return `Sent ${at(link.sentAt)}; the link works until ${day.format(new Date(link.expiresAt))}.`;
    case 'not-sent':
      return link.mailProblem ?? 'The mail server did not take it.';
    case 'revoked':
      return `Withdrawn ${at(link.revokedAt)}: it no longer opens the proposal.`;
    case 'expired':
      return `Expired ${day.format(new Date(link.expiresAt))}.`;
    case 'superseded':
      return 'A newer version was issued; this link no longer opens the proposal.';
  }
}

/** One e-mailed link: to whom, which version, its state from the real mail state; withdraw or send again. */
export function LinkRow({
  link,
  canResend,
  busy,
  onRevoke,
  onResend,
}: {
  link: ProposalLinkRecord;
  canResend: boolean;
  busy: boolean;
  onRevoke: () => void;
  onResend: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  const state = STATE[link.state];
  const live = link.state === 'waiting-to-send' || link.state === 'sent';
  return (
    <li className="flex flex-col gap-2 rounded-md border border-line bg-white p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="min-w-0 break-all font-semibold text-ink-900">{link.to}</p>
        <span className={`rounded-sm px-2 py-0.5 text-sm font-semibold ${state.className}`}>{state.label}</span>
      </div>
      <p className="text-sm text-muted">
        Version {link.versionNumber}
        {link.createdBy ? ` · sent by ${link.createdBy}` : ''} · {at(link.createdAt)}
      </p>
      <p className="text-base text-ink-950">{detail(link)}</p>
      {confirming ? (
        <div className="flex flex-col gap-2 rounded-md bg-ink-50 p-3" role="group" aria-label="Withdraw this link?">
          <p className="text-base">
            Withdraw the link sent to {link.to}? It stops working at once, also on a page already open.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" busy={busy} onClick={onRevoke}>
              Withdraw link
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          {live ? (
            <Button variant="secondary" onClick={() => setConfirming(true)}>
              Withdraw
            </Button>
          ) : null}
          {canResend && link.state !== 'revoked' ? (
            <Button variant="secondary" busy={busy} onClick={onResend}>
              Send again
            </Button>
          ) : null}
        </div>
      )}
    </li>
  );
}
