import type { CsvColumn, Draft, Rec } from './csv-columns';
import type { Dataset } from './datasets';

export interface CellError {
  readonly column: string;
  readonly message: string;
}

export type ReadResult<R> =
  { readonly ok: true; readonly record: R } | { readonly ok: false; readonly errors: readonly CellError[] };

/** The record's cells in the dataset's column order. */
export function recordToCells(dataset: Dataset, record: Rec): string[] {
  return dataset.columns.map((c) => c.read(record));
}

function columnFor(columns: readonly CsvColumn[], path: readonly PropertyKey[], draft: Rec): string {
  return columns.find((c) => c.owns(path, draft))?.name ?? columns[0]?.name ?? '';
}

/**
 * Reads one row (cells named by column) into a record the dataset's schema accepts, or the
 * errors per column. Columns not in `cells` are left empty.
 */
export function recordFromCells(
  dataset: Dataset,
  cells: Readonly<Record<string, string>>,
): ReadResult<{ key: string }> {
  const draft: Draft = {};
  const errors: CellError[] = [];
  for (const c of dataset.columns) {
    const message = c.write(draft, cells[c.name] ?? '');
    if (message !== null) errors.push({ column: c.name, message });
  }
  if (errors.length > 0) return { ok: false, errors };
  const parsed = dataset.schema.safeParse(draft);
  if (parsed.success) return { ok: true, record: parsed.data };
  const seen = new Set<string>();
  for (const issue of parsed.error.issues) {
    const column = columnFor(dataset.columns, issue.path, draft);
    const message = issue.message;
    const id = `${column}\u0000${message}`;
    if (!seen.has(id)) errors.push({ column, message });
    seen.add(id);
  }
  return { ok: false, errors };
}

/** Maps schema issues on a record (e.g. a form's JSON) to the CSV column names, for one message vocabulary. */
export function columnOfPath(dataset: Dataset, path: readonly PropertyKey[], record: Rec): string {
  return columnFor(dataset.columns, path, record);
}
