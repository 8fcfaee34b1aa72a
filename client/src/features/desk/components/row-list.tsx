import type { ReactNode } from 'react';
import { Button } from '../../../components/ui/button';

/**
 * A repeated block of fields with "Add …" and a "Remove" per row — the desk's zones, systems, circuits and
 * discounts (react-hook-form's useFieldArray rows: pass its `fields`, `append` and `remove`). A row can be
 * removed while more than `minRows` remain; "Add" stops at `maxRows`, saying so.
 */
export function RowList({
  legend,
  rows,
  rowLabel,
  addLabel,
  onAdd,
  onRemove,
  children,
  minRows = 0,
  maxRows,
  disabled = false,
  rowClassName = 'grid gap-3',
  nested = false,
}: {
  legend: string;
  rows: readonly { id: string }[];
  /** What a row is called ("Zone 2"), for its group and its Remove button. */
  rowLabel: (index: number) => string;
  addLabel: string;
  onAdd: () => void;
  onRemove: (index: number) => void;
  children: (index: number) => ReactNode;
  minRows?: number;
  maxRows?: number;
  disabled?: boolean;
  rowClassName?: string;
  /** A list inside another list's row (circuits in a system): no frame of its own around each row. */
  nested?: boolean;
}) {
  const full = maxRows !== undefined && rows.length >= maxRows;
  return (
    <fieldset className="flex min-w-0 flex-col gap-3" disabled={disabled}>
      <legend className={nested ? 'text-sm font-semibold text-ink-900' : 'text-base font-semibold text-ink-900'}>
        {legend}
      </legend>
      {rows.map((row, i) => (
        <div
          key={row.id}
          role="group"
          aria-label={rowLabel(i)}
          className={`flex min-w-0 flex-col gap-2 ${nested ? 'border-l-4 border-line pl-3' : 'rounded-md border border-line p-3'}`}
        >
          <div className={rowClassName}>{children(i)}</div>
          {rows.length > minRows && !disabled ? (
            <Button variant="ghost" className="self-start" onClick={() => onRemove(i)}>
              Remove {rowLabel(i).toLowerCase()}
            </Button>
          ) : null}
        </div>
      ))}
      {!disabled ? (
        <div className="flex flex-wrap items-center gap-2">
          <Button variant="secondary" className="self-start" disabled={full} onClick={onAdd}>
            {addLabel}
          </Button>
          {full ? <span className="text-sm text-muted">At most {maxRows}.</span> : null}
        </div>
      ) : null}
    </fieldset>
  );
}
