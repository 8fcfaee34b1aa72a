import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { useOutbox } from '../api/get-outbox';
import { MessageReader } from './message-reader';

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export function OutboxView() {
  const { data: messages, refetch, isFetching } = useOutbox();
  const [openId, setOpenId] = useState<string | null>(null);
  const open = messages.find((m) => m.id === openId) ?? null;

  if (messages.length === 0) {
    return (
      <EmptyState
        title="No e-mail sent yet"
        action={
          <Button variant="secondary" busy={isFetching} onClick={() => void refetch()}>
            Check again
          </Button>
        }
      >
        Messages Gaugeline sends on this development server are caught here instead of being delivered.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4 md:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      <div className="flex flex-col gap-2">
        <Button variant="secondary" className="self-start" busy={isFetching} onClick={() => void refetch()}>
          Refresh
        </Button>
        <ul aria-label="Messages" className="flex flex-col gap-2">
          {messages.map((m) => (
            <li key={m.id}>
              <button
                type="button"
                aria-pressed={m.id === openId}
                onClick={() => setOpenId(m.id)}
                className={`block min-h-touch w-full rounded-md border px-3 py-2 text-left ${m.id === openId ? 'border-ink-600 bg-ink-50' : 'border-line bg-white hover:bg-ink-50'}`}
              >
                <span className="block font-semibold text-ink-900">{m.subject || '(no subject)'}</span>
                <span className="block text-sm text-muted">
                  To {m.to.join(', ')} · {when.format(new Date(m.receivedAt))}
                </span>
              </button>
            </li>
          ))}
        </ul>
      </div>
      {open ? (
        <MessageReader message={open} onClose={() => setOpenId(null)} />
      ) : (
        <p className="text-muted">Choose a message to read it.</p>
      )}
    </div>
  );
}
