import type { Rec } from './csv-columns';
import type { Dataset } from './datasets';
import { recordFromCells, recordToCells, type CellError } from './records';
import { restoreCell } from './csv-safety';
import { metricVariant, type CsvUnitSystem } from './metric-columns';

/** Limits every import is held to (the server refuses larger files, naming the limit). */
export const IMPORT_LIMITS = { maxBytes: 2_000_000, maxRows: 5000 } as const;

export interface ImportRowIn {
  /** The line the row starts on in the file (1 = the header). */
  readonly line: number;
  readonly cells: readonly string[];
}

export interface CellChange {
  readonly column: string;
  readonly before: string;
  readonly after: string;
}

export type RowOutcome =
  | { readonly line: number; readonly key: string; readonly status: 'added'; readonly record: { key: string } }
  | {
      readonly line: number;
      readonly key: string;
      readonly status: 'changed';
      readonly changes: readonly CellChange[];
      readonly record: { key: string };
    }
  | { readonly line: number; readonly key: string; readonly status: 'unchanged' }
  | {
      readonly line: number;
      readonly key: string | null;
      readonly status: 'refused';
      readonly errors: readonly CellError[];
    };

export interface ImportDiff {
  /** Problems with the file as a whole (header); when present no row is read. */
  readonly fileErrors: readonly string[];
  readonly rows: readonly RowOutcome[];
  /** Keys held now that the file does not list. An import never deletes: they are kept as they are. */
  readonly notInFile: readonly string[];
  readonly counts: { added: number; changed: number; unchanged: number; refused: number };
  /** True when the file has no refusals and changes something. */
  readonly canApply: boolean;
}

/**
 * Compares a file's rows with the records held now. Each row is read through the dataset's
 * columns and schema; a row is compared cell by cell in canonical form, so formatting
 * differences ("12.50" vs "12.5") are not changes. Keys repeated in the file are refused.
 * `checkRecord` adds checks that need other tables (e.g. an unknown category).
 */
export function diffImport({
  dataset,
  header,
  rows,
  current,
  checkRecord,
  units = 'imperial',
}: {
  readonly dataset: Dataset;
  /** A metric company's file may name each unit-bearing column in metric instead (not both). */
  readonly units?: CsvUnitSystem;
  readonly header: readonly string[];
  readonly rows: readonly ImportRowIn[];
  readonly current: ReadonlyMap<string, Rec>;
  readonly checkRecord?: (record: { key: string }) => readonly CellError[];
}): ImportDiff {
  const cleanHeader = header.map((h, i) => (i === 0 ? h.replace(/^\uFEFF/, '') : h).trim().toLowerCase());
  const fileErrors: string[] = [];
  // Each unit-bearing column is read in the unit its header names; both variants at once is refused.
  const mixed: string[] = [];
  const columns = dataset.columns.map((c) => {
    const metric = metricVariant(c);
    if (!metric || !cleanHeader.includes(metric.name)) return c;
    if (units !== 'metric') return c;
    if (cleanHeader.includes(c.name)) mixed.push(`${c.name} and ${metric.name}`);
    return metric;
  });
  const names = columns.map((c) => c.name);
  const read = { ...dataset, columns };
  if (mixed.length > 0)
    fileErrors.push(
      `The same value is given in both units: ${mixed.join('; ')}. Keep one column of each pair (metric or imperial).`,
    );
  const bothUnits = new Set(mixed.map((m) => m.split(' and ')[0]));
  const unknown = cleanHeader.filter((h) => !names.includes(h) && !bothUnits.has(h));
  const metricNames = dataset.columns.map((c) => metricVariant(c)?.name);
  if (units !== 'metric' && unknown.some((h) => metricNames.includes(h)))
    fileErrors.push('Metric columns are read only when the company uses metric units (set in the company settings).');
  const missing = names.filter((n) => !cleanHeader.includes(n));
  const repeated = cleanHeader.filter((h, i) => cleanHeader.indexOf(h) !== i);
  if (unknown.length > 0) fileErrors.push(`Unknown columns: ${unknown.join(', ')}.`);
  if (missing.length > 0) fileErrors.push(`Missing columns: ${missing.join(', ')}. Start from the template.`);
  if (repeated.length > 0) fileErrors.push(`Columns listed twice: ${[...new Set(repeated)].join(', ')}.`);
  const counts = { added: 0, changed: 0, unchanged: 0, refused: 0 };
  if (fileErrors.length > 0) return { fileErrors, rows: [], notInFile: [], counts, canApply: false };

  const outcomes: RowOutcome[] = [];
  const seenKeys = new Map<string, number>();
  const keyColumn = names[0] ?? 'key';
  for (const row of rows) {
    const rawKey = (row.cells[cleanHeader.indexOf(keyColumn)] ?? '').trim();
    const key = rawKey === '' ? null : restoreCell(rawKey);
    if (row.cells.length !== cleanHeader.length) {
      outcomes.push({
        line: row.line,
        key,
        status: 'refused',
        errors: [
          { column: '(row)', message: `The row has ${row.cells.length} cells; the header has ${cleanHeader.length}` },
        ],
      });
      continue;
    }
    const cells: Record<string, string> = {};
    cleanHeader.forEach((h, i) => {
      cells[h] = restoreCell(row.cells[i] ?? '');
    });
    const parsed = recordFromCells(read, cells);
    const errors = parsed.ok ? [...(checkRecord?.(parsed.record) ?? [])] : [...parsed.errors];
    if (key !== null && seenKeys.has(key))
      errors.push({ column: keyColumn, message: `${key} is also on line ${seenKeys.get(key)}` });
    if (key !== null && !seenKeys.has(key)) seenKeys.set(key, row.line);
    if (!parsed.ok || errors.length > 0) {
      outcomes.push({ line: row.line, key, status: 'refused', errors });
      continue;
    }
    const record = parsed.record;
    const held = current.get(record.key);
    if (!held) {
      outcomes.push({ line: row.line, key: record.key, status: 'added', record });
      continue;
    }
    const before = recordToCells(read, held);
    const after = recordToCells(read, record);
    const changes: CellChange[] = [];
    names.forEach((n, i) => {
      if (before[i] !== after[i]) changes.push({ column: n, before: before[i] ?? '', after: after[i] ?? '' });
    });
    outcomes.push(
      changes.length === 0
        ? { line: row.line, key: record.key, status: 'unchanged' }
        : { line: row.line, key: record.key, status: 'changed', changes, record },
    );
  }
  for (const o of outcomes) counts[o.status] += 1;
  const inFile = new Set(outcomes.map((o) => o.key));
  const notInFile = [...current.keys()].filter((k) => !inFile.has(k)).sort();
  return {
    fileErrors,
    rows: outcomes,
    notInFile,
    counts,
    canApply: counts.refused === 0 && counts.added + counts.changed > 0,
  };
}
