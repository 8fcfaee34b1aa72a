import type { DatasetId } from '@calc';
import { useHistory } from '../api/get-history';
import { columnHeading } from '../model/table-view';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
const SOURCE = { edit: 'edited', import: 'imported', seed: 'demo data' } as const;

/** Who changed what, when: each change cell by cell, newest first. */
export function RowHistory({ dataset, rowKey }: { dataset: DatasetId; rowKey: string }) {
  const history = useHistory(dataset, rowKey, true);
  return (
    <section aria-label="Price history" className="flex flex-col gap-2">
      <h3 className="text-base font-semibold text-ink-900">History</h3>
      {history.isPending ? <p className="text-sm text-muted">Loading…</p> : null}
      {history.isError ? <p className="text-sm text-danger">The history could not be loaded.</p> : null}
      <ol className="flex flex-col gap-2">
        {(history.data ?? []).map((h) => (
          <li key={h.id} className="rounded-md border border-line px-3 py-2 text-sm">
            <p className="text-muted">
              {when.format(new Date(h.changedAt))} · {h.changedBy?.name ?? 'Gaugeline'} · {SOURCE[h.source]}
            </p>
            {h.action === 'created' ? (
              <p>Added.</p>
            ) : (
              <ul>
                {h.changes.map((c) => (
                  <li key={c.column}>
                    {columnHeading(c.column)}: <span className="line-through">{c.before || '—'}</span> →{' '}
                    <strong>{c.after || '—'}</strong>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ol>
    </section>
  );
}
