import { useId, useState } from 'react';
import { takeoffEditSchema, type OptionRecord, type TakeoffLineRecord } from '@contract';
import { Button } from '../../../components/ui/button';
import { inputClass } from '../../../components/ui/field-shell';
import { errorMessage } from '../../../lib/api-error';
import { useSetTakeoffEdits } from '../api/set-takeoff-edits';
import { editsOf, withLine } from '../model/takeoff-edits';

const dollars = (cents: number | null | undefined) =>
  cents === null || cents === undefined ? '' : (cents / 100).toFixed(2);

/** One line's quantity and unit cost, edited in place; the contract's rules check them before anything is sent. */
export function TakeoffLineEditor({
  jobId,
  option,
  line,
  onDone,
}: {
  jobId: string;
  option: OptionRecord;
  line: TakeoffLineRecord;
  onDone: () => void;
}) {
  const id = useId();
  const save = useSetTakeoffEdits(jobId);
  const [qty, setQty] = useState(String(line.quantity));
  const [cost, setCost] = useState(dollars(line.unitCostCents));
  const [error, setError] = useState<string | null>(null);
  const send = (set: Parameters<typeof withLine>[2]) => {
    setError(null);
    save.mutate({ option, edits: withLine(editsOf(option), line, set) }, { onSuccess: onDone });
  };
  const handleSave = () => {
    const quantity = qty.trim() === '' ? Number.NaN : Number(qty);
    const unitCostCents = cost.trim() === '' ? undefined : Math.round(Number(cost) * 100);
    const checks = [
      takeoffEditSchema.safeParse({ kind: 'quantity', itemKey: line.itemKey, quantity }),
      ...(unitCostCents === undefined
        ? []
        : [takeoffEditSchema.safeParse({ kind: 'unit-price', itemKey: line.itemKey, unitCostCents })]),
    ];
    const refused = checks.find((c) => !c.success);
    if (refused && !refused.success) {
      setError(refused.error.issues[0]?.message ?? 'Check the values.');
      return;
    }
    send({ quantity, unitCostCents });
  };
  return (
    <div className="flex flex-col gap-2 rounded-md border border-amber-line bg-amber-soft/40 p-2">
      <div className="flex flex-wrap items-end gap-2">
        <label htmlFor={`${id}-q`} className="flex flex-col text-sm font-semibold">
          Quantity ({line.unit})
          <input
            id={`${id}-q`}
            className={`${inputClass} w-28`}
            inputMode="decimal"
            value={qty}
            aria-invalid={error ? true : undefined}
            onChange={(e) => setQty(e.target.value)}
          />
        </label>
        {line.unitCostCents !== undefined ? (
          <label htmlFor={`${id}-c`} className="flex flex-col text-sm font-semibold">
            Unit cost ($)
            <input
              id={`${id}-c`}
              className={`${inputClass} w-32`}
              inputMode="decimal"
              value={cost}
              onChange={(e) => setCost(e.target.value)}
            />
          </label>
        ) : null}
        <Button busy={save.isPending} onClick={handleSave}>
          Save line
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
      <div className="flex flex-wrap gap-2">
        {line.edited ? (
          <Button variant="secondary" disabled={save.isPending} onClick={() => send({ reset: true })}>
            Back to the generated values
          </Button>
        ) : null}
        {line.source === 'generated' ? (
          <Button variant="danger" disabled={save.isPending} onClick={() => send({ remove: true })}>
            Remove this line
          </Button>
        ) : null}
      </div>
      {error || save.isError ? (
        <p role="alert" className="text-sm font-semibold text-danger">
          {error ?? errorMessage(save.error)}
        </p>
      ) : null}
    </div>
  );
}
