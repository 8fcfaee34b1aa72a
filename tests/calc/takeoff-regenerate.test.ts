import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { regenerateTakeoff, type GeneratedLine, type TakeoffEdit } from '@calc';

// Rules of the merge (issue 13, "Materials and labor"): an edit stays while what it replaced is unchanged;
// otherwise it is listed for the estimator. No trade figures here, only the rule.
const gl = (itemKey: string, quantity: number, unitCostCents: number | null = 100): GeneratedLine => ({
  itemKey,
  description: itemKey,
  quantity,
  unit: 'ft',
  category: 'material',
  derivation: 'generated',
  unitCostCents,
});

describe('regenerate keeps the edits that still apply', () => {
  const edits: TakeoffEdit[] = [
    { kind: 'quantity', itemKey: 'cable', quantity: 60, generatedQuantity: 50 },
    { kind: 'quantity', itemKey: 'cover', quantity: 3, generatedQuantity: 2 },
    { kind: 'unit-price', itemKey: 'pad', unitCostCents: 4000, generatedUnitCostCents: 4200 },
    { kind: 'remove', itemKey: 'tape' },
    { kind: 'remove', itemKey: 'sleeve' },
    { kind: 'add', line: gl('pump-guard', 1, 2500) },
    { kind: 'add', line: gl('whip', 1, 2100) },
  ];
  const next = [gl('cable', 50), gl('cover', 4), gl('pad', 1, 4200), gl('tape', 1), gl('whip', 1, 2000)];
  const r = regenerateTakeoff({ next, edits });
  it('applies unchanged edits and shows the generated value beside the edited one', () => {
    const cable = r.lines.find((l) => l.itemKey === 'cable');
    expect(cable?.quantity).toBe(60);
    expect(cable?.generated?.quantity).toBe(50);
    expect(cable?.edited).toBe(true);
    expect(r.lines.find((l) => l.itemKey === 'pad')?.unitCostCents).toBe(4000);
    expect(r.lines.some((l) => l.itemKey === 'tape')).toBe(false);
    expect(r.lines.find((l) => l.itemKey === 'pump-guard')?.source).toBe('added');
  });
  it('lists the ones that no longer apply, with the reason', () => {
    expect(r.staleEdits.map((s) => [editKey(s.edit), s.reason])).toEqual([
      ['cover', 'quantity-changed'],
      ['sleeve', 'item-gone'],
      ['whip', 'now-generated'],
    ]);
    expect(r.lines.find((l) => l.itemKey === 'cover')?.quantity).toBe(4);
    expect(r.keptEdits).toHaveLength(4);
  });
  it('every edit is either kept or listed, never both or lost', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ k: fc.constantFrom('a', 'b', 'c', 'd'), q: fc.integer({ min: 0, max: 5 }) }), {
          maxLength: 4,
        }),
        fc.array(
          fc.record({
            k: fc.constantFrom('a', 'b', 'c', 'e'),
            q: fc.integer({ min: 0, max: 5 }),
            g: fc.integer({ min: 0, max: 5 }),
          }),
          { maxLength: 6 },
        ),
        (gen, ed) => {
          const uniq = [...new Map(gen.map((g) => [g.k, gl(g.k, g.q)])).values()];
          const es: TakeoffEdit[] = ed.map((e) => ({
            kind: 'quantity',
            itemKey: e.k,
            quantity: e.q,
            generatedQuantity: e.g,
          }));
          const out = regenerateTakeoff({ next: uniq, edits: es });
          expect(out.keptEdits.length + out.staleEdits.length).toBe(es.length);
        },
      ),
    );
  });
});

function editKey(e: TakeoffEdit): string {
  return e.kind === 'add' ? e.line.itemKey : e.itemKey;
}
