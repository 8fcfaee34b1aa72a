import { describe, expect, it } from 'vitest';
import {
  checkCombination,
  checkSizing,
  computeDesign,
  DEFAULT_SIZING_POLICY,
  explainSizing,
  heatingBalance,
  indoorUnitSchema,
  outdoorUnitSchema,
  type DesignInput,
  type Explanation,
} from '@calc';
import { catalog, design, priceBook, pricing, threeRoomHome } from './sample-data';

const outdoor24 = outdoorUnitSchema.parse(catalog.outdoorUnits[0]);

describe('sizing in plain words', () => {
  it('cooling 114 % of the load: within the 90–130 % range (cooling-dominated: the variable AC limit)', () => {
    // 24,000 Btu/h at 95 °F (the maker's rating) ÷ (18,000 + 3,000) = 114.29 %; policy 90–130 % for variable speed
    // [MEM: ACCA Manual S 2nd ed. limits as company policy]; heat loss 10,000 < cooling 21,000 → cooling dominates
    const load = { sensibleBtuh: 18000, latentBtuh: 3000, heatingBtuh: 10000 };
    const sizing = checkSizing({
      unit: outdoor24,
      equipmentType: outdoor24.equipmentType,
      load,
      coolingDesignF: 95,
      heatingDesignF: 10,
      policy: DEFAULT_SIZING_POLICY,
    });
    const ex = explainSizing({
      keyPrefix: '',
      who: 'Main',
      sizing,
      cooling: outdoor24.cooling,
      heating: outdoor24.heating,
      equipmentType: outdoor24.equipmentType,
      coolingDesignF: 95,
      heatingDesignF: 10,
      sensibleLoadBtuh: 18000,
      latentLoadBtuh: 3000,
    });
    const ratio = ex.find((e) => e.key === 'cooling-ratio');
    expect(ratio?.text).toBe('24,000 Btu/h ÷ 21,000 Btu/h = 114 %');
    expect(ratio?.verdict).toBe(
      'cooling 114 % of the load: within the 90–130 % range for a cooling-dominated climate, so the heat pump takes the air conditioner’s limit',
    );
    // heating: 5 → 21,000 and 47 → 27,000 Btu/h; at 10 °F: 21,000 + 5 × 6,000 / 42 = 21,714 Btu/h ÷ 10,000 = 217 %
    expect(ex.find((e) => e.key === 'heating-coverage')?.text).toBe(
      '21,714 Btu/h at 10 °F (between the 5 and 47 °F ratings) ÷ 10,000 Btu/h heat loss = 217 %',
    );
  });
  it('capacity outside the data says so', () => {
    const sizing = checkSizing({
      unit: outdoor24,
      equipmentType: outdoor24.equipmentType,
      load: { sensibleBtuh: 18000, latentBtuh: 3000, heatingBtuh: 10000 },
      coolingDesignF: 110,
      heatingDesignF: -10,
      policy: DEFAULT_SIZING_POLICY,
    });
    const ex = explainSizing({
      keyPrefix: '',
      who: 'Main',
      sizing,
      cooling: outdoor24.cooling,
      heating: outdoor24.heating,
      equipmentType: outdoor24.equipmentType,
      coolingDesignF: 110,
      heatingDesignF: -10,
      sensibleLoadBtuh: 18000,
      latentLoadBtuh: 3000,
    });
    expect(ex.find((e) => e.key === 'cooling-capacity')?.text).toContain(
      "outside the maker's data: extended from the 105 and 95 °F ratings",
    );
    expect(ex.find((e) => e.key === 'heating-coverage')?.text).toContain("outside the maker's data");
  });
});

describe('balance point and backup heat [PUB: bin method — building load line from the design loss to 0 at the set point]', () => {
  it('worked by hand: 30,000 Btu/h at 10 °F, 70 °F inside, capacity 21,000 @ 5 °F – 27,000 @ 47 °F', () => {
    // loss 500 × (70 − T); capacity 21,000 + (T − 5) × 1,000/7 → (4,500/7) T = 103,000/7 → T = 22.89 °F
    // shortfall at 10 °F: 30,000 − 21,714.29 = 8,286 Btu/h ÷ 3,412.14 Btu/h per kW = 2.43 kW → 2.5 kW (rounded up)
    const b = heatingBalance({
      keyPrefix: '',
      who: 'Main',
      heating: outdoor24.heating ?? [],
      heatLossBtuh: 30000,
      heatingDesignF: 10,
      indoorF: 70,
    });
    expect(b.balancePointF).toBe(22.9);
    expect(b.shortfallBtuh).toBe(8286);
    expect(b.backupKw).toBe(2.5);
    const kit = heatingBalance({
      keyPrefix: '',
      who: 'Main',
      heating: outdoor24.heating ?? [],
      heatLossBtuh: 30000,
      heatingDesignF: 10,
      indoorF: 70,
      heatKit: { description: '5 kW kit', kw: 5 },
    });
    // 5 kW × 3,412.14 = 17,061 Btu/h ≥ 8,286
    expect(kit.explanations.find((e) => e.key === 'backup-heat')?.verdict).toBe(
      'The chosen heat kit covers the shortfall.',
    );
  });
});

describe('multi-zone combinations (maker port table)', () => {
  const o = outdoorUnitSchema.parse({
    ...catalog.outdoorUnits[0],
    portSizesBtuh: [
      [9000, 12000, 18000],
      [9000, 12000],
      [9000, 12000],
    ],
  });
  const head = (k: number) =>
    indoorUnitSchema.parse({
      ...catalog.indoorUnits[0],
      key: `H${k}`,
      description: `${k}k head`,
      nominalBtuh: k * 1000,
    });
  it('seats an 18k head on port A and counts connected capacity: (18 + 9) / 24 = 113 %', () => {
    const c = checkCombination({ outdoor: o, indoor: [head(9), head(18)] });
    expect(c.ok).toBe(true);
    expect(c.ports).toEqual([1, 0]);
    expect(c.connectedPercent).toBe(113);
  });
  it('refuses two 18k heads (only port A takes 18k) and a fourth head, with the reason', () => {
    const c = checkCombination({ outdoor: o, indoor: [head(18), head(18)] });
    expect(c.ok).toBe(false);
    expect(c.refusals[0]).toContain('cannot all be seated');
    const d = checkCombination({ outdoor: o, indoor: [head(9), head(9), head(9), head(9)] });
    expect(d.refusals[0]).toBe('GL-O24 three-port outdoor unit takes at most 3 indoor unit(s); 4 are connected.');
    expect(checkCombination({ outdoor: o, indoor: [head(24)] }).refusals[0]).toContain(
      'no port of GL-O24 three-port outdoor unit accepts that size',
    );
  });
});

describe('the design result explains itself and lists its blockers', () => {
  const run = (d: DesignInput) => computeDesign({ home: threeRoomHome, design: d, catalog, priceBook, pricing });
  const all = (r: ReturnType<typeof run>): Explanation[] => [
    ...r.zones.flatMap((z) => z.explanations),
    ...r.systems.flatMap((s) => s.explanations),
    ...r.explanations,
  ];
  it('every explanation key is unique and the same inputs give the same characters', () => {
    const a = all(run(design));
    expect(new Set(a.map((e) => e.key)).size).toBe(a.length);
    expect(JSON.stringify(all(run(design)))).toBe(JSON.stringify(a));
    expect(run(design).blockers).toEqual([]);
  });
  it('a run past the maker limit and an R-410A install in 2026 block "ready to propose"', () => {
    const base = design.systems[0];
    if (!base) throw new Error('sample');
    const long: DesignInput = {
      ...design,
      installDate: '2026-03-01',
      systems: [{ ...base, circuits: base.circuits.map((c, i) => (i === 0 ? { ...c, lengthFt: 90 } : c)) }],
    };
    const r = run(long);
    // maker: 82 ft per circuit (sample data); R-32 GWP 675 < 700 so the rule does not block
    expect(r.blockers.map((b) => [b.code, b.kind])).toEqual([['limit-exceeded', 'lines']]);
    expect(r.blockers[0]?.message).toBe('Line set for Living is 90 ft; the maker allows at most 82 ft.');
  });
});
