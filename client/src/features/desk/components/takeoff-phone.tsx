import { formatMoney, formatNumber } from '@calc';
import type { OptionRecord, TakeoffLineRecord } from '@contract';
import { Button } from '../../../components/ui/button';
import type { ExplanationView } from '../model/result-view';
import { editedValues } from '../model/takeoff-edits';
import { DeskFold } from './desk-fold';
import { TakeoffLineEditor } from './takeoff-line-editor';
import { RuleWords } from './sell-rule';

const CATEGORY_WORDS: Readonly<Record<string, string>> = {
  equipment: 'Equipment',
  material: 'Materials',
  labor: 'Labor',
};
const categoryName = (c: string) => CATEGORY_WORDS[c] ?? c.charAt(0).toUpperCase() + c.slice(1);

const qty = (n: number, unit: string) => `${formatNumber(n, 2, { trim: true })} ${unit}`;

/** The lines by category, in the takeoff's own order (equipment, materials, labor as calc lists them). */
function groupsOf(lines: readonly TakeoffLineRecord[]): { category: string; lines: TakeoffLineRecord[] }[] {
  const out: { category: string; lines: TakeoffLineRecord[] }[] = [];
  for (const l of lines) {
    const g = out.find((x) => x.category === l.category);
    if (g) g.lines.push(l);
    else out.push({ category: l.category, lines: [l] });
  }
  return out;
}

/** A group's money in its one line: the sell total where the role sees prices, else the cost total, else none. */
function groupMoney(lines: readonly TakeoffLineRecord[]): string | null {
  if (lines.some((l) => l.sellCents !== undefined))
    return `${formatMoney(lines.reduce((sum, l) => sum + (l.sellCents ?? 0), 0))} sell`;
  if (lines.some((l) => l.extendedCostCents !== undefined))
    return `${formatMoney(lines.reduce((sum, l) => sum + (l.extendedCostCents ?? 0), 0))} cost`;
  return null;
}

/** One line folded to its item, quantity and sell price; open, its derivation, cost, the sell rule's why and the editor. */
function LineCard({
  jobId,
  option,
  line: l,
  why,
  canEdit,
  editing,
  onEdit,
}: {
  jobId: string;
  option: OptionRecord;
  line: TakeoffLineRecord;
  why: ExplanationView | undefined;
  canEdit: boolean;
  editing: boolean;
  onEdit: (on: boolean) => void;
}) {
  const edited = editedValues(l);
  return (
    <li className="border-t border-line first:border-t-0">
      <DeskFold
        startOpen={editing}
        summary={
          <>
            <span className="min-w-0 flex-1">
              <span className="block font-semibold break-words text-ink-900">{l.description}</span>
              {l.edited || l.source === 'added' ? (
                <span className="block text-xs text-amber-deep">{l.source === 'added' ? 'added' : 'edited'}</span>
              ) : null}
            </span>
            <span className="shrink-0 text-right tabular-nums">
              <span className="block">{qty(l.quantity, l.unit)}</span>
              {l.sellCents !== undefined ? (
                <span className="block font-semibold">{formatMoney(l.sellCents)}</span>
              ) : null}
            </span>
          </>
        }
      >
        <div className="flex flex-col gap-1 pb-2 pl-6 text-sm">
          <p className="break-words text-muted">{l.derivation}</p>
          {edited.quantity ? (
            <p className="text-amber-deep">generated {qty(l.generatedQuantity ?? 0, l.unit)}</p>
          ) : null}
          {l.unitCostCents !== undefined ? (
            <p className="tabular-nums">
              Unit cost {l.unitCostCents === null ? 'no price' : formatMoney(l.unitCostCents)}
              {edited.unitCost ? (
                <span className="text-amber-deep"> (generated {formatMoney(l.generatedUnitCostCents ?? 0)})</span>
              ) : null}
              ; cost {formatMoney(l.extendedCostCents ?? 0)}
            </p>
          ) : null}
          {l.sellCents !== undefined ? (
            <div className="tabular-nums">
              Sell {formatMoney(l.sellCents)}
              {l.sellRule ? <RuleWords rule={l.sellRule} /> : null}
              {why ? <p className="mt-1 font-mono text-xs text-ink-900">{why.text}</p> : null}
            </div>
          ) : null}
          {canEdit ? (
            editing ? (
              <TakeoffLineEditor jobId={jobId} option={option} line={l} onDone={() => onEdit(false)} />
            ) : (
              <div>
                <Button variant="secondary" onClick={() => onEdit(true)} aria-label={`Edit ${l.description}`}>
                  Edit
                </Button>
              </div>
            )
          ) : null}
        </div>
      </DeskFold>
    </li>
  );
}

/**
 * The takeoff on a phone: one line per category (how many lines, their total), each opening to its lines,
 * and each line to its figures. The table with every column stays for wider screens.
 */
export function TakeoffGroups({
  jobId,
  option,
  lines,
  whys,
  canEdit,
  editing,
  onEdit,
}: {
  jobId: string;
  option: OptionRecord;
  lines: readonly TakeoffLineRecord[];
  whys?: ReadonlyMap<string, ExplanationView>;
  canEdit: boolean;
  editing: string | null;
  onEdit: (itemKey: string | null) => void;
}) {
  return (
    <ul aria-label="Materials and labor by category" className="flex flex-col gap-2">
      {groupsOf(lines).map((g) => {
        const money = groupMoney(g.lines);
        const edited = g.lines.filter((l) => l.edited || l.source === 'added').length;
        return (
          <li key={g.category} className="rounded-md border border-line px-2">
            <DeskFold
              startOpen={g.lines.some((l) => l.itemKey === editing)}
              summary={
                <>
                  <span className="min-w-0 flex-1">
                    <span className="font-semibold text-ink-900">{categoryName(g.category)}</span>{' '}
                    <span className="text-muted">
                      · {g.lines.length} {g.lines.length === 1 ? 'line' : 'lines'}
                      {edited > 0 ? ` · ${edited} edited` : ''}
                    </span>
                  </span>
                  {money ? <span className="shrink-0 font-semibold tabular-nums">{money}</span> : null}
                </>
              }
            >
              <ul className="pb-1">
                {g.lines.map((l) => (
                  <LineCard
                    key={l.itemKey}
                    jobId={jobId}
                    option={option}
                    line={l}
                    why={whys?.get(`sell:${l.itemKey}`)}
                    canEdit={canEdit}
                    editing={editing === l.itemKey}
                    onEdit={(on) => onEdit(on ? l.itemKey : null)}
                  />
                ))}
              </ul>
            </DeskFold>
          </li>
        );
      })}
    </ul>
  );
}
