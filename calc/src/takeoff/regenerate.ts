import type { TakeoffLine } from './lines';

/** A generated line with its cost per unit (null when the price book has none). */
export interface GeneratedLine extends TakeoffLine {
  readonly unitCostCents: number | null;
}

/**
 * One estimator's edit to a takeoff. Quantity and price edits remember the generated value they
 * replaced, so a later regeneration can tell whether the design moved under them.
 */
export type TakeoffEdit =
  | {
      readonly kind: 'quantity';
      readonly itemKey: string;
      readonly quantity: number;
      /** The generated quantity when the edit was made. */
      readonly generatedQuantity: number;
    }
  | {
      readonly kind: 'unit-price';
      readonly itemKey: string;
      readonly unitCostCents: number;
      readonly generatedUnitCostCents: number | null;
    }
  | { readonly kind: 'remove'; readonly itemKey: string }
  | { readonly kind: 'add'; readonly line: GeneratedLine };

/** A line of the merged takeoff: what calc generated beside what the estimator set. */
export interface MergedLine extends GeneratedLine {
  /** Calc's own quantity and unit cost (null for a line the estimator added). */
  readonly generated: { readonly quantity: number; readonly unitCostCents: number | null } | null;
  readonly edited: boolean;
  readonly source: 'generated' | 'added';
}

export type StaleReason = 'item-gone' | 'quantity-changed' | 'price-changed' | 'now-generated';

/** An edit that no longer applies as it stands, for the estimator to accept again or drop. */
export interface StaleEdit {
  readonly edit: TakeoffEdit;
  readonly reason: StaleReason;
  /** Plain words: "Line-set kit 1/4 × 3/8 in, 25 ft: the design no longer has this line." */
  readonly message: string;
  /** The generated value the edit was made against, and the one now. */
  readonly before: number | null;
  readonly now: number | null;
}

export interface RegeneratedTakeoff {
  readonly lines: readonly MergedLine[];
  readonly keptEdits: readonly TakeoffEdit[];
  readonly staleEdits: readonly StaleEdit[];
}

const editKey = (e: TakeoffEdit) => (e.kind === 'add' ? e.line.itemKey : e.itemKey);

/**
 * Regenerates a takeoff after a design change, keeping the estimator's edits that still apply:
 * - quantity edit: kept while the line is still generated with the same generated quantity it
 *   replaced; if the design changed that quantity (or dropped the line) it is listed, not applied;
 * - unit-price edit: kept while the line exists and its price-book cost is the one it replaced;
 * - removal: kept while the line is still generated; listed (item-gone) once the design drops it;
 * - added line: kept unless calc now generates the same item (listed as now-generated).
 * Edits listed as stale are not applied; the generated value stands until the estimator
 * accepts (re-sends) or drops them. Order: the new generated lines in their order, then added
 * lines in edit order. Pure; edits later in the list win over earlier ones of the same kind and key.
 */
export function regenerateTakeoff({
  next,
  edits,
}: {
  /** The newly generated lines. */
  readonly next: readonly GeneratedLine[];
  readonly edits: readonly TakeoffEdit[];
}): RegeneratedTakeoff {
  const byKey = new Map<string, GeneratedLine>();
  for (const l of next) byKey.set(l.itemKey, l);
  const kept: TakeoffEdit[] = [];
  const stale: StaleEdit[] = [];
  const quantity = new Map<string, number>();
  const price = new Map<string, number>();
  const removed = new Set<string>();
  const added: GeneratedLine[] = [];
  for (const e of edits) {
    const line = byKey.get(editKey(e));
    const name = e.kind === 'add' ? e.line.description : (line?.description ?? e.itemKey);
    if (e.kind === 'add') {
      if (line) {
        stale.push({
          edit: e,
          reason: 'now-generated',
          message: `${name}: the design now includes this line itself (${line.quantity} ${line.unit}); keep your added line as well?`,
          before: null,
          now: line.quantity,
        });
      } else {
        kept.push(e);
        added.push(e.line);
      }
      continue;
    }
    if (!line) {
      stale.push({
        edit: e,
        reason: 'item-gone',
        message: `${name}: the design no longer has this line, so your ${e.kind === 'remove' ? 'removal' : 'change'} no longer applies.`,
        before: e.kind === 'quantity' ? e.generatedQuantity : e.kind === 'unit-price' ? e.generatedUnitCostCents : null,
        now: null,
      });
      continue;
    }
    if (e.kind === 'quantity') {
      if (line.quantity !== e.generatedQuantity) {
        stale.push({
          edit: e,
          reason: 'quantity-changed',
          message: `${name}: you set ${e.quantity} ${line.unit} when the design gave ${e.generatedQuantity}; it now gives ${line.quantity}.`,
          before: e.generatedQuantity,
          now: line.quantity,
        });
        continue;
      }
      quantity.set(e.itemKey, e.quantity);
    } else if (e.kind === 'unit-price') {
      if (line.unitCostCents !== e.generatedUnitCostCents) {
        stale.push({
          edit: e,
          reason: 'price-changed',
          message: `${name}: you set a unit cost of ${e.unitCostCents} cents over the price book's ${e.generatedUnitCostCents ?? 'none'}; the price book now says ${line.unitCostCents ?? 'none'}.`,
          before: e.generatedUnitCostCents,
          now: line.unitCostCents,
        });
        continue;
      }
      price.set(e.itemKey, e.unitCostCents);
    } else {
      removed.add(e.itemKey);
    }
    kept.push(e);
  }
  const lines: MergedLine[] = [];
  for (const l of next) {
    if (removed.has(l.itemKey)) continue;
    const q = quantity.get(l.itemKey);
    const p = price.get(l.itemKey);
    lines.push({
      itemKey: l.itemKey,
      description: l.description,
      quantity: q ?? l.quantity,
      unit: l.unit,
      category: l.category,
      derivation: l.derivation,
      unitCostCents: p ?? l.unitCostCents,
      generated: { quantity: l.quantity, unitCostCents: l.unitCostCents },
      edited: (q !== undefined && q !== l.quantity) || (p !== undefined && p !== l.unitCostCents),
      source: 'generated',
    });
  }
  for (const a of added)
    lines.push({
      itemKey: a.itemKey,
      description: a.description,
      quantity: a.quantity,
      unit: a.unit,
      category: a.category,
      derivation: a.derivation,
      unitCostCents: a.unitCostCents,
      generated: null,
      edited: true,
      source: 'added',
    });
  return { lines, keptEdits: kept, staleEdits: stale };
}
