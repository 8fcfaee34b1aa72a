import { describe, expect, it } from 'vitest';
import type { OptionRecord } from '@contract';
import { editedValues, editsOf, withLine } from '../../client/src/features/desk/model/takeoff-edits';

const line = { itemKey: 'lineset:sys-1:zone-1', generatedQuantity: 25, generatedUnitCostCents: 4200 };

/** An option holding the stored edits the server answers with (calc's TakeoffEdit, generated values beside). */
function optionWith(edits: Record<string, unknown>[]): Pick<OptionRecord, 'takeoffEdits'> {
  return { takeoffEdits: edits.map((edit, i) => ({ key: `k${i}`, edit, stale: null })) };
}

describe('the desk’s takeoff edits', () => {
  it('sends stored edits back in the shape the PUT takes, without the generated values calc kept beside them', () => {
    const option = optionWith([
      { kind: 'quantity', itemKey: 'a', quantity: 30, generatedQuantity: 25 },
      { kind: 'unit-price', itemKey: 'b', unitCostCents: 900, generatedUnitCostCents: 1000 },
      { kind: 'remove', itemKey: 'c' },
      {
        kind: 'add',
        line: {
          itemKey: 'added:x1',
          description: 'Surge protector',
          quantity: 1,
          unit: 'each',
          category: 'material',
          unitCostCents: 5500,
        },
      },
    ]);
    expect(editsOf(option)).toEqual([
      { kind: 'quantity', itemKey: 'a', quantity: 30 },
      { kind: 'unit-price', itemKey: 'b', unitCostCents: 900 },
      { kind: 'remove', itemKey: 'c' },
      {
        kind: 'add',
        id: 'x1',
        description: 'Surge protector',
        quantity: 1,
        unit: 'each',
        category: 'material',
        unitCostCents: 5500,
      },
    ]);
  });

  it('replaces one line’s edits, and a value equal to the generated one is no edit', () => {
    const others = [{ kind: 'remove' as const, itemKey: 'other' }];
    const before = [...others, { kind: 'quantity' as const, itemKey: line.itemKey, quantity: 40 }];
    expect(withLine(before, line, { quantity: 30, unitCostCents: 4200 })).toEqual([
      ...others,
      { kind: 'quantity', itemKey: line.itemKey, quantity: 30 },
    ]);
    expect(withLine(before, line, { quantity: 25 })).toEqual(others);
    expect(withLine(before, line, { reset: true })).toEqual(others);
    expect(withLine(before, line, { remove: true })).toEqual([...others, { kind: 'remove', itemKey: line.itemKey }]);
  });

  it('marks a value edited only where it differs from the generated one (the screens show that one beside it)', () => {
    const generated = { quantity: 25, generatedQuantity: 25, unitCostCents: 4200, generatedUnitCostCents: 4200 };
    expect(editedValues(generated)).toEqual({ quantity: false, unitCost: false });
    expect(editedValues({ ...generated, quantity: 30 })).toEqual({ quantity: true, unitCost: false });
    expect(editedValues({ ...generated, unitCostCents: 3900 })).toEqual({ quantity: false, unitCost: true });
    // A line the estimator added has nothing generated; a salesperson's lines carry no cost at all.
    expect(
      editedValues({ quantity: 2, generatedQuantity: null, unitCostCents: 500, generatedUnitCostCents: null }),
    ).toEqual({ quantity: false, unitCost: false });
    expect(editedValues({ quantity: 30, generatedQuantity: 25 })).toEqual({ quantity: true, unitCost: false });
  });
});
