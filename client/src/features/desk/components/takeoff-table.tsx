import { useState } from 'react';
import { formatMoney, formatNumber } from '@calc';
import type { OptionRecord, TakeoffLineRecord } from '@contract';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { useRegenerateTakeoff, useSetTakeoffEdits } from '../api/set-takeoff-edits';
import { editedValues, editsOf } from '../model/takeoff-edits';
import type { ExplanationView } from '../model/result-view';
import { usePhone } from '../../../lib/use-phone';
import { RuleWords } from './sell-rule';
import { TakeoffGroups } from './takeoff-phone';
import { TakeoffLineEditor } from './takeoff-line-editor';

/** A line's sell price that opens to calc's why (cost → price, the rule and where it came from). */
function LineSell({
  line,
  why,
  taxWhy,
}: {
  line: TakeoffLineRecord;
  why: ExplanationView | undefined;
  taxWhy: ExplanationView | undefined;
}) {
  if (line.sellCents === undefined) return null;
  const rule = (
    <>
      {line.sellRule ? <RuleWords rule={line.sellRule} /> : null}
      {line.taxed === false ? <span className="block text-muted">not taxed</span> : null}
    </>
  );
  if (!why)
    return (
      <>
        {formatMoney(line.sellCents)}
        {rule}
      </>
    );
  return (
    <details className="text-right">
      <summary className="min-h-touch cursor-pointer list-none">
        {formatMoney(line.sellCents)} <span className="block text-ink-600 underline">why?</span>
        {rule}
      </summary>
      <p className="mt-1 max-w-xs text-left font-mono text-xs text-ink-900">{why.text}</p>
      {taxWhy ? <p className="mt-1 max-w-xs text-left font-mono text-xs text-ink-900">{taxWhy.text}</p> : null}
    </details>
  );
}

/**
 * The takeoff calc generated from the design, priced from the price book (unit costs and each line's sell
 * price with its rule for the office only). Where an edit changed a line, the generated value stands
 * beside the edited one.
 */
export function TakeoffTable({
  jobId,
  option,
  lines,
  whys,
  canEdit,
}: {
  jobId: string;
  option: OptionRecord;
  lines: readonly TakeoffLineRecord[];
  whys?: ReadonlyMap<string, ExplanationView>;
  canEdit: boolean;
}) {
  const costs = lines.some((l) => l.unitCostCents !== undefined);
  const sells = lines.some((l) => l.sellCents !== undefined);
  const [editing, setEditing] = useState<string | null>(null);
  const phone = usePhone();
  const cell = 'py-2 pr-3 text-right align-top';
  // On a phone, one line per category opening to compact lines; from 640 px up, the table with every column.
  if (phone)
    return (
      <div>
        <TakeoffGroups
          jobId={jobId}
          option={option}
          lines={lines}
          whys={whys}
          canEdit={canEdit}
          editing={editing}
          onEdit={setEditing}
        />
        {canEdit ? <EditsAside jobId={jobId} option={option} /> : null}
      </div>
    );
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Materials and labor</caption>
        <thead>
          <tr className="border-b border-line text-left text-muted">
            <th scope="col" className="py-2 pr-3">
              Item
            </th>
            <th scope="col" className="py-2 pr-3 text-right">
              Quantity
            </th>
            {costs ? (
              <>
                <th scope="col" className="py-2 pr-3 text-right">
                  Unit cost
                </th>
                <th scope="col" className="py-2 pr-3 text-right">
                  Cost
                </th>
              </>
            ) : null}
            {sells ? (
              <th scope="col" className="py-2 pr-3 text-right">
                Sell
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => {
            const edited = editedValues(l);
            return (
              <tr key={l.itemKey} className="border-b border-line align-top">
                <th scope="row" className="py-2 pr-3 text-left font-normal">
                  <span className="font-semibold break-words text-ink-900">{l.description}</span>
                  <span className="block break-words text-muted">{l.derivation}</span>
                </th>
                <td className={`${cell} tabular-nums`}>
                  <span className="block text-right">
                    {formatNumber(l.quantity, 2, { trim: true })} {l.unit}
                    {edited.quantity ? (
                      <span className="block text-amber-deep">
                        generated {formatNumber(l.generatedQuantity ?? 0, 2, { trim: true })}
                      </span>
                    ) : null}
                  </span>
                </td>
                {costs ? (
                  <>
                    <td className={`${cell} tabular-nums`}>
                      <span className="block text-right">
                        {l.unitCostCents === null || l.unitCostCents === undefined
                          ? 'no price'
                          : formatMoney(l.unitCostCents)}
                        {edited.unitCost ? (
                          <span className="block text-amber-deep">
                            generated {formatMoney(l.generatedUnitCostCents ?? 0)}
                          </span>
                        ) : null}
                      </span>
                    </td>
                    <td className={`${cell} tabular-nums`}>
                      <span className="block text-right">{formatMoney(l.extendedCostCents ?? 0)}</span>
                    </td>
                  </>
                ) : null}
                {sells ? (
                  <td className={`${cell} tabular-nums`}>
                    <span className="block text-right">
                      <LineSell line={l} why={whys?.get(`sell:${l.itemKey}`)} taxWhy={whys?.get(`tax:${l.itemKey}`)} />
                    </span>
                  </td>
                ) : null}
                {canEdit ? (
                  <td className="py-2 text-right">
                    {editing === l.itemKey ? (
                      <TakeoffLineEditor jobId={jobId} option={option} line={l} onDone={() => setEditing(null)} />
                    ) : (
                      <Button
                        variant="ghost"
                        onClick={() => setEditing(l.itemKey)}
                        aria-label={`Edit ${l.description}`}
                      >
                        Edit
                      </Button>
                    )}
                  </td>
                ) : null}
              </tr>
            );
          })}
        </tbody>
      </table>
      {canEdit ? <EditsAside jobId={jobId} option={option} /> : null}
    </div>
  );
}

/** Removed lines (to put back) and edits that no longer match the design (keep on the new value, or drop). */
function EditsAside({ jobId, option }: { jobId: string; option: OptionRecord }) {
  const save = useSetTakeoffEdits(jobId);
  const regenerate = useRegenerateTakeoff(jobId);
  const removed = option.takeoffEdits.filter((e) => e.edit.kind === 'remove' && !e.stale);
  const stale = option.takeoffEdits.filter((e) => e.stale);
  if (removed.length === 0 && stale.length === 0) return null;
  return (
    <div className="mt-3 flex flex-col gap-2 text-sm">
      {removed.map((e) => (
        <p key={e.key} className="flex flex-wrap items-center gap-2">
          Removed: {String(e.edit.itemKey)}
          <Button
            variant="secondary"
            disabled={save.isPending}
            onClick={() =>
              save.mutate({
                option,
                edits: editsOf(option).filter((x) => !(x.kind === 'remove' && x.itemKey === e.edit.itemKey)),
              })
            }
          >
            Put back
          </Button>
        </p>
      ))}
      {stale.map((e) => (
        <div key={e.key} className="rounded-md border border-amber-line bg-amber-soft p-2">
          <p>{e.stale?.message}</p>
          <div className="mt-1 flex flex-wrap gap-2">
            <Button
              variant="secondary"
              busy={regenerate.isPending}
              onClick={() => regenerate.mutate({ option, accept: [e.key] })}
            >
              Keep the edit
            </Button>
            <Button
              variant="ghost"
              disabled={regenerate.isPending}
              onClick={() => regenerate.mutate({ option, drop: [e.key] })}
            >
              Drop it
            </Button>
          </div>
        </div>
      ))}
      {save.isError || regenerate.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {errorMessage(save.error ?? regenerate.error)}
        </p>
      ) : null}
    </div>
  );
}
