import { describe, expect, it } from 'vitest';
import { DEFAULT_LOSS_REASONS } from '@contract';
import { generateSalesHistory } from '../../fixtures/sales-history';

/** The demo's sales history generator (fixtures/sales-history.ts): deterministic, inside its window, varied. */
const input = {
  seed: 1515,
  endMonth: new Date('2026-12-01T00:00:00Z'),
  months: 18,
  proposals: 360,
  salespeople: [55, 25, 20],
  lostReasons: DEFAULT_LOSS_REASONS,
};

describe('generateSalesHistory', () => {
  it('gives the same proposals for the same seed, and others for another seed', () => {
    const one = generateSalesHistory(input);
    expect(generateSalesHistory(input)).toEqual(one);
    expect(generateSalesHistory({ ...input, seed: 1516 })).not.toEqual(one);
    expect(one).toHaveLength(360);
  });

  it('lies in the 18 months before the end month, each step after the one before', () => {
    const start = Date.UTC(2025, 5, 1); // 18 months before December 2026: June 2025
    for (const h of generateSalesHistory(input)) {
      expect(h.firstVisitAt.getTime()).toBeGreaterThanOrEqual(start);
      expect(h.firstPricedAt.getTime()).toBeGreaterThan(h.firstVisitAt.getTime());
      expect(h.issuedAt[0]!.getTime()).toBeGreaterThan(h.firstPricedAt.getTime());
      const last = h.issuedAt.at(-1)!.getTime();
      expect(last).toBeLessThan(input.endMonth.getTime());
      const o = h.outcome;
      const decided = o.kind === 'won' ? o.signedAt : o.kind === 'lost' || o.kind === 'cancelled' ? o.at : null;
      if (decided) {
        expect(decided.getTime()).toBeGreaterThan(last);
        expect(decided.getTime()).toBeLessThan(input.endMonth.getTime() + 3 * 86_400_000);
      }
    }
  });

  it('has every outcome, every salesperson, options chosen first to third, all three types and the list’s reasons', () => {
    const all = generateSalesHistory(input);
    const kinds = new Set(all.map((h) => h.outcome.kind));
    expect(kinds).toEqual(new Set(['outstanding', 'won', 'lost', 'cancelled']));
    expect(new Set(all.map((h) => h.salesperson))).toEqual(new Set([0, 1, 2]));
    const chosen = new Set(all.flatMap((h) => (h.outcome.kind === 'won' ? [h.outcome.position] : [])));
    expect(chosen).toEqual(new Set([1, 2, 3]));
    expect(new Set(all.flatMap((h) => h.options.map((o) => o.systemType)))).toEqual(
      new Set(['single-zone', 'multi-zone', 'ducted']),
    );
    for (const h of all) if (h.outcome.kind === 'lost') expect(DEFAULT_LOSS_REASONS).toContain(h.outcome.reason);
    // Outstanding proposals of several ages: issued within the last month and long before.
    const ages = all
      .filter((h) => h.outcome.kind === 'outstanding')
      .map((h) => (input.endMonth.getTime() - h.issuedAt.at(-1)!.getTime()) / 86_400_000);
    expect(Math.min(...ages)).toBeLessThan(30);
    expect(Math.max(...ages)).toBeGreaterThan(90);
  });
});
