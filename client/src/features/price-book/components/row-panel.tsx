import { useState, type FormEvent } from 'react';
import { DATASETS, columnOfPath, recordFromCells, visibleColumns, type DataRole, type DatasetId } from '@calc';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { inputClass as sharedInputClass } from '../../../components/ui/field-shell';
import { isApiError } from '../../../lib/api-error';
import { useSaveRow } from '../api/save-row';
import { columnHeading } from '../model/table-view';
import type { CompanyDataRowRecord as DataRow } from '@contract';
import { CapacityChart } from './capacity-chart';
import { RowHistory } from './row-history';

interface Props {
  dataset: DatasetId;
  role: DataRole;
  canEdit: boolean;
  /** null: a new record. */
  row: DataRow | null;
  onClose: () => void;
  onSaved: (key: string) => void;
}

// The shared input look, greyed when a key cannot change.
const inputClass = `${sharedInputClass} disabled:bg-ink-50`;

/**
 * One record, every column the role may see. Editors change the cells as text, the same cells as
 * the CSV, read back through calc's columns and schema (the server checks the same), so a bound
 * shows its message beside the cell before anything is sent.
 */
export function RowPanel({ dataset, role, canEdit, row, onClose, onSaved }: Props) {
  const ds = DATASETS[dataset];
  const columns = visibleColumns(ds, role);
  const initial = () =>
    Object.fromEntries(columns.map((c) => [c.name, row ? c.read(row.record) : ''])) as Record<string, string>;
  const [cells, setCells] = useState<Record<string, string>>(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<{ tone: 'ok' | 'danger'; text: string } | null>(null);
  const save = useSaveRow();
  const title = row ? row.key : `New ${ds.noun}`;

  const handleSubmit = (e: FormEvent) => {
    e.preventDefault();
    setNotice(null);
    const read = recordFromCells(ds, cells);
    if (!read.ok) {
      setErrors(Object.fromEntries(read.errors.map((x) => [x.column, x.message])));
      return;
    }
    setErrors({});
    save.mutate(
      { dataset, record: read.record, ...(row ? { key: row.key, version: row.version } : {}) },
      {
        onSuccess: () => {
          setNotice({ tone: 'ok', text: 'Saved.' });
          onSaved(read.record.key);
        },
        onError: (err) => {
          if (isApiError(err) && err.errors.length > 0)
            setErrors(
              Object.fromEntries(
                err.errors.map((x) => [
                  columnOfPath(ds, x.path.replace(/^record\./, '').split('.'), read.record),
                  x.message,
                ]),
              ),
            );
          setNotice({ tone: 'danger', text: isApiError(err) ? err.detail : 'Not saved.' });
        },
      },
    );
  };

  return (
    <aside
      aria-label={`${ds.noun} ${title}`}
      className="flex flex-col gap-4 rounded-lg border border-line bg-white p-4 shadow-card"
    >
      <div className="flex items-start justify-between gap-2">
        <div>
          <p className="text-sm text-muted">{ds.label}</p>
          <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
        </div>
        <Button variant="ghost" onClick={onClose}>
          Close
        </Button>
      </div>
      {dataset === 'models' && row ? <CapacityChart record={row.record} /> : null}
      {canEdit ? null : (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-base">
          {columns
            .filter((c) => (cells[c.name] ?? '') !== '')
            .map((c) => (
              <div key={c.name} className="contents">
                <dt className="text-sm font-semibold text-ink-900" title={c.help}>
                  {columnHeading(c.name)}
                </dt>
                <dd className="min-w-0 tabular-nums [overflow-wrap:anywhere]">{cells[c.name]}</dd>
              </div>
            ))}
        </dl>
      )}
      {canEdit ? (
        <form onSubmit={handleSubmit} noValidate className="flex flex-col gap-3">
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            {columns.map((c, i) => {
              const id = `cell-${c.name}`;
              const error = errors[c.name];
              return (
                <div key={c.name} className="flex flex-col gap-1">
                  <label htmlFor={id} className="text-sm font-semibold text-ink-900">
                    {columnHeading(c.name)}
                  </label>
                  <input
                    id={id}
                    className={inputClass}
                    value={cells[c.name] ?? ''}
                    disabled={i === 0 && row !== null}
                    aria-invalid={error ? true : undefined}
                    aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
                    onChange={(e) => setCells((prev) => ({ ...prev, [c.name]: e.target.value }))}
                  />
                  <p id={`${id}-hint`} className="text-xs text-muted">
                    {c.help}
                  </p>
                  {error ? (
                    <p id={`${id}-error`} className="text-sm font-semibold text-danger">
                      {error}
                    </p>
                  ) : null}
                </div>
              );
            })}
          </div>
          {notice ? <Alert tone={notice.tone}>{notice.text}</Alert> : null}
          <div className="flex flex-wrap gap-2">
            <Button type="submit" busy={save.isPending}>
              {row ? 'Save changes' : `Add ${ds.noun}`}
            </Button>
            <Button variant="secondary" onClick={() => setCells(initial())}>
              Undo edits
            </Button>
          </div>
        </form>
      ) : null}
      {row && canEdit ? <RowHistory dataset={dataset} rowKey={row.key} /> : null}
    </aside>
  );
}
