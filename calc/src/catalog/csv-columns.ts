/**
 * CSV column codecs: each column turns one field of a record into a cell and back. A record
 * read from a file is the draft the columns build, then validated by the dataset's zod
 * schema; a schema issue is mapped back to the column that owns its path. Cells are
 * canonical (numbers without trailing zeros, money as dollars with two decimals, tube sizes
 * as fractions, yes/no), so export → import compares equal cell by cell.
 */

export type Draft = Record<string, unknown>;
export type Rec = Readonly<Record<string, unknown>>;

export interface CsvColumn {
  readonly name: string;
  readonly help: string;
  /** The record's value as a cell ('' when absent). */
  read(record: Rec): string;
  /** Puts the cell's value into the draft; returns a message when the cell cannot be read. */
  write(draft: Draft, cell: string): string | null;
  /** Whether a schema issue at `path` belongs to this column. */
  owns(path: readonly PropertyKey[], draft: Rec): boolean;
}

const NUMBER = /^-?\d{1,9}(\.\d{1,6})?$/;
const MONEY = /^\$?(\d{1,3}(,\d{3})+|\d{1,9})(\.\d{1,2})?$/;

/** A cell as a number, or undefined when empty, or a message. */
export function readNumberCell(cell: string): number | undefined | string {
  const t = cell.trim();
  if (t === '') return undefined;
  if (!NUMBER.test(t)) return `"${t.slice(0, 20)}" is not a number`;
  return Number(t);
}

/** Dollars ("1,234.5", "$12", "12.34") as integer cents, exactly (no float multiply). */
export function dollarsToCents(cell: string): number | undefined | string {
  const t = cell.trim();
  if (t === '') return undefined;
  if (!MONEY.test(t)) return `"${t.slice(0, 20)}" is not an amount in dollars (e.g. 1234.50)`;
  const [whole = '0', frac = ''] = t.replace(/[$,]/g, '').split('.');
  return Number(whole) * 100 + Number(frac.padEnd(2, '0'));
}

export function centsToDollars(cents: number): string {
  const whole = Math.floor(cents / 100);
  return `${whole}.${String(cents - whole * 100).padStart(2, '0')}`;
}

const fmt = (v: unknown): string => (typeof v === 'number' ? String(v) : '');
const get = (r: Rec, field: string): unknown => r[field];
const ownsField =
  (...fields: string[]) =>
  (path: readonly PropertyKey[]) =>
    typeof path[0] === 'string' && fields.includes(path[0]);

export function textCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => {
      const v = get(r, field);
      return typeof v === 'string' ? v : '';
    },
    write: (d, cell) => {
      const t = cell.trim();
      if (t !== '') d[field] = t;
      return null;
    },
    owns: ownsField(field),
  };
}

export function numberCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => fmt(get(r, field)),
    write: (d, cell) => {
      const v = readNumberCell(cell);
      if (typeof v === 'string') return v;
      if (v !== undefined) d[field] = v;
      return null;
    },
    owns: ownsField(field),
  };
}

export function moneyCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => {
      const v = get(r, field);
      return typeof v === 'number' ? centsToDollars(v) : '';
    },
    write: (d, cell) => {
      const v = dollarsToCents(cell);
      if (typeof v === 'string') return v;
      if (v !== undefined) d[field] = v;
      return null;
    },
    owns: ownsField(field),
  };
}

export function boolCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => (get(r, field) === true ? 'yes' : get(r, field) === false ? 'no' : ''),
    write: (d, cell) => {
      const t = cell.trim().toLowerCase();
      if (t === '') return null;
      if (['yes', 'y', 'true', '1'].includes(t)) d[field] = true;
      else if (['no', 'n', 'false', '0'].includes(t)) d[field] = false;
      else return 'Enter yes or no';
      return null;
    },
    owns: ownsField(field),
  };
}

const TUBE_LABELS: ReadonlyArray<readonly [number, string]> = [
  [0.25, '1/4'],
  [0.3125, '5/16'],
  [0.375, '3/8'],
  [0.5, '1/2'],
  [0.625, '5/8'],
  [0.75, '3/4'],
  [0.875, '7/8'],
];
export const tubeSizeLabel = (od: number): string => TUBE_LABELS.find(([v]) => v === od)?.[1] ?? String(od);
export function parseTube(cell: string): number | undefined | string {
  const t = cell.trim();
  if (t === '') return undefined;
  const byLabel = TUBE_LABELS.find(([, l]) => l === t);
  if (byLabel) return byLabel[0];
  const n = readNumberCell(t);
  if (typeof n === 'number' && TUBE_LABELS.some(([v]) => v === n)) return n;
  return 'Tube size must be 1/4, 5/16, 3/8, 1/2, 5/8, 3/4 or 7/8';
}

export function tubeCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => {
      const v = get(r, field);
      return typeof v === 'number' ? tubeSizeLabel(v) : '';
    },
    write: (d, cell) => {
      const v = parseTube(cell);
      if (typeof v === 'string') return v;
      if (v !== undefined) d[field] = v;
      return null;
    },
    owns: ownsField(field),
  };
}

/** A list of keys separated by "|". */
export function listCol(name: string, field: string, help: string): CsvColumn {
  return {
    name,
    help,
    read: (r) => {
      const v = get(r, field);
      return Array.isArray(v) ? v.map(String).join('|') : '';
    },
    write: (d, cell) => {
      const parts = cell
        .split('|')
        .map((s) => s.trim())
        .filter((s) => s !== '');
      d[field] = parts;
      return null;
    },
    owns: ownsField(field),
  };
}

/** One half of an optional nested sell rule (method or percent). */
export function sellRuleCols(prefix: string, field: string, help: string): CsvColumn[] {
  const part = (r: Rec): Rec | undefined => {
    const v = get(r, field);
    return typeof v === 'object' && v !== null ? (v as Rec) : undefined;
  };
  const draftRule = (d: Draft): Draft => {
    const existing = d[field];
    if (typeof existing === 'object' && existing !== null) return existing as Draft;
    const made: Draft = {};
    d[field] = made;
    return made;
  };
  return [
    {
      name: `${prefix}_method`,
      help: `${help}: markup or margin`,
      read: (r) => {
        const m = part(r)?.['method'];
        return typeof m === 'string' ? m : '';
      },
      write: (d, cell) => {
        const t = cell.trim().toLowerCase();
        if (t !== '') draftRule(d)['method'] = t;
        return null;
      },
      owns: (path) => path[0] === field && (path.length === 1 || path[1] === 'method'),
    },
    {
      name: `${prefix}_percent`,
      help: `${help}: the percent`,
      read: (r) => fmt(part(r)?.['percent']),
      write: (d, cell) => {
        const v = readNumberCell(cell);
        if (typeof v === 'string') return v;
        if (v !== undefined) draftRule(d)['percent'] = v;
        return null;
      },
      owns: (path) => path[0] === field && (path.length === 1 || path[1] === 'percent'),
    },
  ];
}
