import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { errorMessage } from '../../../lib/api-error';
import { useMessages } from '../api/get-messages';
import { useRetryMessage } from '../api/retry-message';
import type { MailMessageRecord as Message } from '@contract';

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

const KIND_LABEL: Record<Message['kind'], string> = {
  'new-user': 'New account',
  'password-changed': 'Password changed',
  'password-reset': 'Password reset link',
  'proposal-link': 'Proposal sent to a customer',
  'signed-proposal': 'Signed proposal copy',
};

const STATE: Record<Message['state'], { label: string; className: string }> = {
  waiting: { label: 'Sending', className: 'bg-ink-50 text-ink-800' },
  retrying: { label: 'Not sent yet', className: 'bg-amber-soft text-amber-deep' },
  failed: { label: 'Failed', className: 'bg-danger-soft text-danger' },
  sent: { label: 'Sent', className: 'bg-ok-soft text-ok' },
};

const needsAttention = (m: Message) => m.state === 'retrying' || m.state === 'failed';

function MessageRow({ message }: { message: Message }) {
  const retry = useRetryMessage();
  const state = STATE[message.state];
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-line bg-white p-3 sm:flex-row sm:items-start sm:justify-between">
      <div className="min-w-0">
        <p className="font-semibold text-ink-900">{message.subject}</p>
        <p className="text-sm break-all text-muted">
          To {message.to} · {KIND_LABEL[message.kind]} · {when.format(new Date(message.createdAt))}
        </p>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm">
          <span className={`rounded-sm px-2 py-0.5 font-semibold ${state.className}`}>{state.label}</span>
          {message.state === 'sent' && message.sentAt ? (
            <span className="text-muted">{when.format(new Date(message.sentAt))}</span>
          ) : null}
          {message.attempts > 0 && message.state !== 'sent' ? (
            <span className="text-muted">
              {message.attempts} {message.attempts === 1 ? 'try' : 'tries'}
              {message.nextAttemptAt ? `, next ${when.format(new Date(message.nextAttemptAt))}` : ''}
            </span>
          ) : null}
        </p>
        {message.lastError && message.state !== 'sent' ? (
          <p className="mt-1 text-sm text-ink-950">{message.lastError}</p>
        ) : null}
        {retry.error ? (
          <p role="alert" className="mt-1 text-sm font-semibold text-danger">
            {errorMessage(retry.error)}
          </p>
        ) : null}
      </div>
      {needsAttention(message) ? (
        <Button
          variant="secondary"
          className="shrink-0 self-start"
          busy={retry.isPending}
          aria-label={`Try again: ${message.subject} to ${message.to}`}
          onClick={() => retry.mutate(message.id)}
        >
          Try again
        </Button>
      ) : null}
    </li>
  );
}

/** E-mail the app sent or is trying to send; the ones that keep failing come first. */
export function MailList() {
  const { data: messages } = useMessages();
  if (messages.length === 0) {
    return (
      <EmptyState title="No e-mail yet">
        Messages Gaugeline sends for your company (new accounts, password notices) are listed here with how their
        delivery went.
      </EmptyState>
    );
  }
  const failing = messages.filter(needsAttention);
  const rest = messages.filter((m) => !needsAttention(m));
  return (
    <div className="flex flex-col gap-4">
      {failing.length > 0 ? (
        <Alert
          tone="warning"
          title={`${failing.length} ${failing.length === 1 ? 'message has' : 'messages have'} not gone out`}
        >
          Gaugeline keeps trying for about ten hours. Check the mail server settings, then choose Try again.
        </Alert>
      ) : null}
      {failing.length > 0 ? (
        <ul aria-label="Not sent" className="flex flex-col gap-2">
          {failing.map((m) => (
            <MessageRow key={m.id} message={m} />
          ))}
        </ul>
      ) : null}
      {rest.length > 0 ? (
        <section>
          <h2 className="mb-2 text-lg font-semibold text-ink-900">Recent</h2>
          <ul aria-label="Recent e-mail" className="flex flex-col gap-2">
            {rest.map((m) => (
              <MessageRow key={m.id} message={m} />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
