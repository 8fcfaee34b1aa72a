import type { ProposalEventRecord } from '@contract';
import { formatStamp } from '../model/dates';
import { describeEvent, eventActor } from '../model/event-words';

/** The proposal's audit trail in the order it happened (the database's `seq`), in words. */
export function AuditTrail({ events }: { events: readonly ProposalEventRecord[] }) {
  const ordered = [...events].sort((a, b) => a.seq - b.seq);
  return (
    <section aria-labelledby="trail-heading" className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4">
      <h2 id="trail-heading" className="text-lg font-semibold text-ink-900">
        What happened, in order
      </h2>
      <ol className="flex flex-col divide-y divide-line" aria-label="Audit trail">
        {ordered.map((e) => {
          const w = describeEvent(e);
          return (
            <li key={e.seq} className="flex flex-col gap-0.5 py-2">
              <span className="text-base font-semibold text-ink-900">{w.title}</span>
              {w.detail ? <span className="break-all text-sm text-ink-950">{w.detail}</span> : null}
              <span className="text-sm text-muted">
                {formatStamp(e.at)} · {eventActor(e)}
              </span>
            </li>
          );
        })}
      </ol>
    </section>
  );
}
