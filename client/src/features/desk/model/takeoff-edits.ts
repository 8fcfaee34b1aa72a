import { takeoffEditSchema, type OptionRecord, type TakeoffEditInput, type TakeoffLineRecord } from '@contract';

const ADDED = 'added:';

/** A stored edit (calc's TakeoffEdit, with the generated value it replaced) as the PUT takes it back. */
function asInput(edit: Record<string, unknown>): TakeoffEditInput | null {
  const line = edit.line;
  const candidate =
    edit.kind === 'add' && typeof line === 'object' && line !== null
      ? {
          kind: 'add',
          id: String(Reflect.get(line, 'itemKey') ?? '').replace(ADDED, ''),
          description: Reflect.get(line, 'description'),
          quantity: Reflect.get(line, 'quantity'),
          unit: Reflect.get(line, 'unit'),
          category: Reflect.get(line, 'category'),
          unitCostCents: Reflect.get(line, 'unitCostCents'),
        }
      : edit.kind === 'quantity'
        ? { kind: edit.kind, itemKey: edit.itemKey, quantity: edit.quantity }
        : edit.kind === 'unit-price'
          ? { kind: edit.kind, itemKey: edit.itemKey, unitCostCents: edit.unitCostCents }
          : { kind: edit.kind, itemKey: edit.itemKey };
  const parsed = takeoffEditSchema.safeParse(candidate);
  return parsed.success ? parsed.data : null;
}

export const editsOf = (option: Pick<OptionRecord, 'takeoffEdits'>): TakeoffEditInput[] =>
  option.takeoffEdits.flatMap((e) => {
    const i = asInput(e.edit);
    return i ? [i] : [];
  });

/** Which of a line's values differ from what calc generated (the screens show the generated one beside it). */
export function editedValues(
  line: Pick<TakeoffLineRecord, 'quantity' | 'generatedQuantity' | 'unitCostCents' | 'generatedUnitCostCents'>,
): { quantity: boolean; unitCost: boolean } {
  return {
    quantity: line.generatedQuantity !== null && line.generatedQuantity !== line.quantity,
    unitCost:
      line.generatedUnitCostCents !== undefined &&
      line.generatedUnitCostCents !== null &&
      line.generatedUnitCostCents !== line.unitCostCents,
  };
}

const about = (e: TakeoffEditInput, itemKey: string) => e.kind !== 'add' && e.itemKey === itemKey;

/**
 * The option's edits with one line's edits replaced: a value equal to the generated one is no edit
 * (the line goes back to what calc generated).
 */
export function withLine(
  edits: readonly TakeoffEditInput[],
  line: { itemKey: string; generatedQuantity: number | null; generatedUnitCostCents?: number | null | undefined },
  set: { quantity?: number; unitCostCents?: number; remove?: boolean; reset?: boolean },
): TakeoffEditInput[] {
  const rest = edits.filter((e) => !about(e, line.itemKey));
  if (set.reset) return rest;
  if (set.remove) return [...rest, { kind: 'remove', itemKey: line.itemKey }];
  const out = [...rest];
  if (set.quantity !== undefined && set.quantity !== line.generatedQuantity)
    out.push({ kind: 'quantity', itemKey: line.itemKey, quantity: set.quantity });
  if (set.unitCostCents !== undefined && set.unitCostCents !== line.generatedUnitCostCents)
    out.push({ kind: 'unit-price', itemKey: line.itemKey, unitCostCents: set.unitCostCents });
  return out;
}
