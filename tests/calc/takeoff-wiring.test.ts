import { describe, expect, it } from 'vitest';
import {
  branchConductors,
  computeDesign,
  computeDesignFromParsed,
  DEFAULT_SIZING_POLICY,
  designSchema,
  egcCopperAwg,
  equipmentCatalogSchema,
  homeInputSchema,
  priceBookSchema,
  pricingSchema,
  racewaySize,
  type DesignInput,
  type DesignResult,
} from '@calc';
import { catalog, design, pricing, priceBook, threeRoomHome } from './sample-data';

const qty = (r: DesignResult, key: string) => r.takeoff.find((l) => l.itemKey === key)?.quantity;
const line = (r: DesignResult, key: string) => r.takeoff.find((l) => l.itemKey === key);

/** The sample design with its branch circuit in another wiring method. */
function withWiring(wiringMethod: 'nm-b' | 'thhn-conduit' | 'uf-b', circuitLengthFt = 42): DesignInput {
  return {
    ...design,
    systems: design.systems.map((s) => ({ ...s, electrical: { ...s.electrical, wiringMethod, circuitLengthFt } })),
  };
}
const run = (d: DesignInput) => computeDesign({ home: threeRoomHome, design: d, catalog, priceBook, pricing });

// Copper equipment grounding conductor by breaker rating [MEM: NEC Table 250.122, copper column]:
// 15 A → 14, 20 A → 12, 30–60 A → 10, 100 A → 8, 200 A → 6 AWG.
const TABLE_250_122: Array<[number, number]> = [
  [15, 14],
  [20, 12],
  [30, 10],
  [40, 10],
  [60, 10],
  [70, 8],
  [100, 8],
  [150, 6],
  [200, 6],
];

describe('conductors of a 240 V branch circuit', () => {
  it.each(TABLE_250_122)('a %i A breaker takes a %i AWG copper equipment ground [MEM: NEC Table 250.122]', (a, awg) => {
    expect(egcCopperAwg({ ocpdA: a })).toBe(awg);
  });
  it('two ungrounded conductors and one equipment ground, never larger than the hots [MEM: NEC 250.122(A)]', () => {
    // 12 AWG on a 30 A breaker (an air conditioner's MOCP allows it, NEC 440.22): the table says 10 AWG, but the
    // ground need not exceed the circuit conductors, so 12 AWG.
    expect(branchConductors({ awg: 12, ocpdA: 30 })).toEqual({
      hot: { count: 2, awg: 12 },
      ground: { count: 1, awg: 12 },
    });
    expect(branchConductors({ awg: 6, ocpdA: 60 })).toEqual({
      hot: { count: 2, awg: 6 },
      ground: { count: 1, awg: 10 },
    });
  });
});

describe('raceway fill [MEM: NEC Chapter 9 Tables 1, 4 and 5]', () => {
  // An independent check: NEC Annex C Table C.1 (EMT, THHN), the most conductors of one size per trade size,
  // from memory — 1/2 in: 14 AWG 12, 12 AWG 9, 10 AWG 5, 8 AWG 3, 6 AWG 2; 3/4 in: 6 AWG 4.
  // Three conductors of one size go in the smallest size whose Annex C count is at least 3.
  const annexC: Record<number, string> = { 14: '1/2', 12: '1/2', 10: '1/2', 8: '1/2', 6: '3/4' };
  it.each(Object.entries(annexC))('three %s AWG THHN conductors need %s in EMT (Annex C.1)', (awg, size) => {
    const n = Number(awg);
    expect(racewaySize({ kind: 'emt', set: { hot: { count: 2, awg: n }, ground: { count: 1, awg: n } } }).size).toBe(
      size,
    );
  });
  it('explains the fill: conductor areas against 40 % of the raceway', () => {
    const r = racewaySize({ kind: 'emt', set: { hot: { count: 2, awg: 10 }, ground: { count: 1, awg: 10 } } });
    // 3 × 0.0211 in² = 0.0633 in² ≤ 0.40 × 0.304 in² = 0.1216 in²
    expect(r.conductorAreaIn2).toBe(0.0633);
    expect(r.allowedIn2).toBe(0.1216);
    expect(r.text).toContain('0.0633 in² ≤ 40 % of 1/2 in EMT (0.1216 in²)');
  });
});

describe('the takeoff counts wire by its conductors', () => {
  // Every length: the run + 1.5 ft at each end for the terminations, + 10 % waste, rounded up to 5 ft
  // (common practice; the company edits its own).
  it('NM-B: one cable holds both hots and the ground, so the cable is the run: (42 + 3) × 1.1 = 49.5 → 50 ft', () => {
    const r = run(withWiring('nm-b'));
    expect(r.systems[0]?.electrical.wireAwg).toBe(12);
    expect(qty(r, 'wire:nm-b:12awg')).toBe(50);
    expect(line(r, 'wire:nm-b:12awg')?.description).toBe('12/2 with ground copper cable, NM-B');
    expect(line(r, 'wire:nm-b:12awg')?.derivation).toContain('1 cable (2 × 12 AWG + ground)');
    expect(r.takeoff.some((l) => l.itemKey.startsWith('raceway:'))).toBe(false);
  });
  it('THHN in conduit: 2 hots × (42 + 3) × 1.1 = 99 → 100 ft, 1 ground → 49.5 → 50 ft, and 1/2 in EMT of 50 ft', () => {
    const r = run(withWiring('thhn-conduit'));
    const e = r.systems[0]?.electrical;
    expect(e?.wireAwg).toBe(12);
    expect(e?.breakerA).toBe(30);
    expect(qty(r, 'wire:thhn-conduit:12awg')).toBe(100);
    // 30 A → 10 AWG by Table 250.122, held to the 12 AWG hots (250.122(A))
    expect(qty(r, 'wire:thhn-conduit-ground:12awg')).toBe(50);
    expect(line(r, 'wire:thhn-conduit-ground:12awg')?.derivation).toContain('NEC Table 250.122');
    // 3 × 12 AWG = 3 × 0.0133 = 0.0399 in² ≤ 0.1216 in²: 1/2 in; 42 ft in 10 ft lengths → 50 ft
    expect(qty(r, 'raceway:emt:1/2')).toBe(50);
    expect(line(r, 'raceway:emt:1/2')?.derivation).toContain('0.0399 in²');
  });
  it('the whip to the unit is sized for its three conductors: 1/2 in for 12 AWG', () => {
    const r = run(withWiring('nm-b'));
    expect(qty(r, 'whip:1/2x6ft')).toBe(1);
    expect(line(r, 'whip:1/2x6ft')?.derivation).toContain('3 conductors');
  });
  it('a longer run grows every length by its conductor count', () => {
    // 100 ft: cable (100 + 3) × 1.1 = 113.3 → 115; hots 2 × 113.3 = 226.6 → 230; ground 113.3 → 115; EMT 100
    const cable = run(withWiring('nm-b', 100));
    expect(qty(cable, 'wire:nm-b:12awg')).toBe(115);
    const conduit = run(withWiring('thhn-conduit', 100));
    expect(qty(conduit, 'wire:thhn-conduit:12awg')).toBe(230);
    expect(qty(conduit, 'wire:thhn-conduit-ground:12awg')).toBe(115);
    expect(qty(conduit, 'raceway:emt:1/2')).toBe(100);
  });
});

describe('explainPrice: false (the server explains its own price after the estimator’s edits)', () => {
  it('the same takeoff and price, without the takeoff and price explanations', () => {
    const full = run(design);
    const lean = computeDesignFromParsed({
      home: homeInputSchema.parse(threeRoomHome),
      design: designSchema.parse(design),
      catalog: equipmentCatalogSchema.parse(catalog),
      priceBook: priceBookSchema.parse(priceBook),
      pricing: pricingSchema.parse(pricing),
      policy: DEFAULT_SIZING_POLICY,
      explainPrice: false,
    });
    expect(lean.takeoff).toEqual(full.takeoff);
    expect(lean.price).toEqual(full.price);
    expect(lean.systems).toEqual(full.systems);
    expect(full.explanations.length).toBeGreaterThan(0);
    expect(lean.explanations).toEqual([]);
  });
});
