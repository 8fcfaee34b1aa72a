import { useState, type ChangeEvent } from 'react';
import { DATASETS, IMPORT_LIMITS, type DatasetId } from '@calc';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClass } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-error';
import { useApplyImport, usePreviewImport } from '../api/import-file';
import { tablePath } from '../api/get-table';
import { columnHeading } from '../model/table-view';
import type { ImportPreviewRecord as ImportPreview } from '@contract';

interface Loaded {
  name: string;
  csv: string;
  preview: ImportPreview & { token: string };
}

const STATUS_LABEL = { added: 'New', changed: 'Changed', unchanged: 'Unchanged', refused: 'Refused' } as const;

/**
 * Import is two steps: choose a file → the preview lists every row (new, changed old → new,
 * refused with line, column and message) → confirm. Nothing is saved until the confirm, and the
 * confirm saves all of it or nothing.
 */
export function ImportPanel({ dataset, onClose }: { dataset: DatasetId; onClose: () => void }) {
  const ds = DATASETS[dataset];
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [message, setMessage] = useState<{ tone: 'ok' | 'danger'; text: string } | null>(null);
  const preview = usePreviewImport();
  const apply = useApplyImport();

  const handleFile = async (e: ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0];
    e.target.value = '';
    setMessage(null);
    setLoaded(null);
    if (!file) return;
    if (file.size > IMPORT_LIMITS.maxBytes) {
      setMessage({ tone: 'danger', text: `The file is larger than the ${IMPORT_LIMITS.maxBytes / 1e6} MB limit.` });
      return;
    }
    const csv = await file.text();
    preview.mutate(
      { dataset, csv },
      {
        onSuccess: (p) => setLoaded({ name: file.name, csv, preview: p }),
        onError: (err) => setMessage({ tone: 'danger', text: isApiError(err) ? err.detail : 'Could not read it.' }),
      },
    );
  };

  const handleConfirm = () => {
    if (!loaded) return;
    apply.mutate(
      { dataset, csv: loaded.csv, token: loaded.preview.token },
      {
        onSuccess: (done) => {
          setLoaded(null);
          setMessage({
            tone: 'ok',
            text: `Imported ${loaded.name}: ${done.counts.added} new, ${done.counts.changed} changed.`,
          });
        },
        onError: (err) => setMessage({ tone: 'danger', text: isApiError(err) ? err.detail : 'Not imported.' }),
      },
    );
  };

  const p = loaded?.preview;
  const listed = p ? p.rows.filter((r) => r.status !== 'unchanged') : [];
  return (
    <section
      aria-label={`Import ${ds.label.toLowerCase()}`}
      className="flex flex-col gap-4 rounded-lg border border-line bg-white p-4 shadow-card"
    >
      <div className="flex items-start justify-between gap-2">
        <h2 className="text-lg font-semibold text-ink-900">Import {ds.label.toLowerCase()} from CSV</h2>
        <Button variant="ghost" onClick={onClose}>
          Close
        </Button>
      </div>
      <p className="text-base text-muted">
        Start from the template or an export. Rows whose first column matches a record change it; new keys are added;
        nothing is deleted. Up to {IMPORT_LIMITS.maxBytes / 1e6} MB and {IMPORT_LIMITS.maxRows} rows.
      </p>
      <div className="flex flex-wrap gap-2">
        <label className={buttonClass('primary', 'cursor-pointer')}>
          Choose a CSV file
          <input type="file" accept=".csv,text/csv" className="sr-only" onChange={(e) => void handleFile(e)} />
        </label>
        <a className={buttonClass('secondary')} href={`${tablePath(dataset)}/csv/template`} download>
          Download the template
        </a>
        <a className={buttonClass('secondary')} href={`${tablePath(dataset)}/csv/export`} download>
          Export all
        </a>
      </div>
      {preview.isPending ? <p className="text-base text-muted">Reading the file…</p> : null}
      {message ? <Alert tone={message.tone}>{message.text}</Alert> : null}
      {p && loaded ? (
        <div className="flex flex-col gap-3">
          <h3 className="text-base font-semibold text-ink-900">Preview of {loaded.name}</h3>
          {p.fileErrors.length > 0 ? (
            <Alert tone="danger" title="The file cannot be imported">
              <ul>
                {p.fileErrors.map((f) => (
                  <li key={f}>{f}</li>
                ))}
              </ul>
            </Alert>
          ) : (
            <p className="text-base" aria-live="polite">
              <strong>{p.counts.added}</strong> new · <strong>{p.counts.changed}</strong> changed ·{' '}
              <strong>{p.counts.unchanged}</strong> unchanged ·{' '}
              <strong className={p.counts.refused > 0 ? 'text-danger' : ''}>{p.counts.refused}</strong> refused
              {p.notInFile.length > 0 ? ` · ${p.notInFile.length} not in the file (kept as they are)` : ''}
            </p>
          )}
          {p.counts.refused > 0 ? (
            <Alert tone="danger">Fix the refused rows in your file and choose it again. Nothing has been saved.</Alert>
          ) : null}
          {listed.length > 0 ? (
            <div className="max-h-[28rem] overflow-auto rounded-md border border-line">
              <table className="w-full text-left text-sm" aria-label="Rows in the file">
                <thead className="sticky top-0 bg-ink-50">
                  <tr>
                    <th className="px-2 py-1">Line</th>
                    <th className="px-2 py-1">Key</th>
                    <th className="px-2 py-1">What happens</th>
                  </tr>
                </thead>
                <tbody>
                  {listed.map((r) => (
                    <tr
                      key={r.line}
                      className={`border-t border-line align-top ${r.status === 'refused' ? 'bg-danger-soft' : ''}`}
                    >
                      <td className="px-2 py-1 tabular-nums">{r.line}</td>
                      <td className="px-2 py-1 font-semibold">{r.key ?? '—'}</td>
                      <td className="px-2 py-1">
                        <span className="font-semibold">{STATUS_LABEL[r.status]}</span>
                        <ul>
                          {(r.changes ?? []).map((c) => (
                            <li key={c.column}>
                              {columnHeading(c.column)}: <span className="line-through">{c.before || '—'}</span> →{' '}
                              <strong>{c.after || '—'}</strong>
                            </li>
                          ))}
                          {(r.errors ?? []).map((x) => (
                            <li key={`${x.column}:${x.message}`} className="text-danger">
                              {x.column}: {x.message}
                            </li>
                          ))}
                        </ul>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button onClick={handleConfirm} disabled={!p.canApply} busy={apply.isPending}>
              Confirm import
            </Button>
            <Button variant="secondary" onClick={() => setLoaded(null)}>
              Cancel
            </Button>
          </div>
          {!p.canApply && p.counts.refused === 0 && p.fileErrors.length === 0 ? (
            <p className="text-sm text-muted">The file changes nothing.</p>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
