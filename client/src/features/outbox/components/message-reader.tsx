import { Button } from '../../../components/ui/button';
import type { OutboxMessage } from '@contract';

/** Shows the plain-text part only: the HTML part is untrusted and never rendered. */
export function MessageReader({ message, onClose }: { message: OutboxMessage; onClose: () => void }) {
  return (
    <article aria-label={message.subject} className="rounded-lg border border-line bg-white p-4 shadow-card">
      <header className="mb-3 border-b border-line pb-3">
        <h2 className="text-lg font-semibold text-ink-900">{message.subject || '(no subject)'}</h2>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-muted">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-muted">To</dt>
          <dd className="break-all">{message.to.join(', ')}</dd>
        </dl>
      </header>
      <pre className="font-sans text-base whitespace-pre-wrap break-words">{message.text}</pre>
      <Button variant="ghost" className="mt-3 md:hidden" onClick={onClose}>
        Back to the list
      </Button>
    </article>
  );
}
