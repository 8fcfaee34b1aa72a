import { describe, expect, it } from 'vitest';
import {
  catalogModelSchema,
  checkSizing,
  computeDesign,
  DEFAULT_SIZING_POLICY,
  designCatalogFromModels,
  designPriceBookFromCompany,
  equipmentTypeOf,
  firstPrice,
  homeLoad,
  kitSchema,
  laborTaskSchema,
  materialSchema,
  refrigerantCostSchema,
  suggestDesign,
  type HomeInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { bedroom, kitchen, livingRoom, pricing, threeRoomHome } from './sample-data';

// The suggestion follows stated rules (calc/src/design/suggest.ts); these tests check the rules hold on the
// invented demo catalog, not any trade figure of their own.
const data = demoCompanyData();
const models = data.models.map((m) => catalogModelSchema.parse(m));
const catalog = designCatalogFromModels(models);
const priceBook = designPriceBookFromCompany({
  models,
  materials: data.materials.map((m) => materialSchema.parse(m)),
  labor: data.labor.map((m) => laborTaskSchema.parse(m)),
  kits: data.kits.map((m) => kitSchema.parse(m)),
  refrigerants: data.refrigerants.map((m) => refrigerantCostSchema.parse(m)),
});
const twoStorey: HomeInput = {
  ...threeRoomHome,
  rooms: [
    livingRoom,
    {
      ...bedroom,
      id: 'bed-2',
      name: 'Bedroom 2',
      lengthFt: 16,
      exposedWalls: [{ direction: 'W', lengthFt: 16, windows: [{ areaFt2: 30, glazing: 'double-clear' }] }],
    },
    kitchen,
    { ...livingRoom, id: 'up-1', name: 'Loft', floorLevel: 2 },
    {
      ...bedroom,
      id: 'up-2',
      name: 'Primary bedroom',
      floorLevel: 2,
      lengthFt: 18,
      exposedWalls: [{ direction: 'S', lengthFt: 18, windows: [{ areaFt2: 40, glazing: 'double-clear' }] }],
    },
  ],
};

describe('suggest from the active catalog', () => {
  const s = suggestDesign({ home: twoStorey, models });
  it('is deterministic', () => {
    expect(JSON.stringify(suggestDesign({ home: twoStorey, models }))).toBe(JSON.stringify(s));
  });
  it('every room is in exactly one zone and every zone is connected', () => {
    const ids = s.design.zones.flatMap((z) => z.roomIds);
    expect([...ids].sort()).toEqual(twoStorey.rooms.map((r) => r.id).sort());
    const connected = s.design.systems.flatMap((x) => x.circuits.map((c) => c.zoneKey));
    expect([...connected].sort()).toEqual(s.design.zones.map((z) => z.key).sort());
  });
  it('no active head smaller than the chosen one is within the sizing range for its zone (the smallest-in-range rule)', () => {
    const loads = homeLoad({ home: twoStorey });
    for (const z of s.design.zones) {
      const chosen = models.find((m) => m.key === z.indoorUnitKey);
      if (!chosen) throw new Error('chosen head is in the catalog');
      expect(loads.rooms.filter((r) => z.roomIds.includes(r.roomId))).toHaveLength(z.roomIds.length);
      const smaller = models.filter(
        (m) =>
          m.active &&
          m.kind === 'indoor' &&
          m.indoorType === 'wall' &&
          (m.nominalCoolingBtuh ?? 0) < (chosen.nominalCoolingBtuh ?? 0),
      );
      const r = computeDesign({ home: twoStorey, design: s.design, catalog, priceBook, pricing });
      const zr = r.zones.find((x) => x.zoneKey === z.key);
      for (const m of smaller) {
        const unit = catalog.indoorUnits.find((u) => u.key === m.key);
        if (!unit || !zr) continue;
        const sameFamily = m.matchedKeys.length > 0 === chosen.matchedKeys.length > 0;
        if (!sameFamily) continue;
        const load = {
          sensibleBtuh: zr.sizing.coolingLoadBtuh - 0,
          latentBtuh: 0,
          heatingBtuh: zr.sizing.heatingLoadBtuh,
        };
        const check = checkSizing({
          unit,
          equipmentType: equipmentTypeOf(m),
          load,
          coolingDesignF: 95,
          heatingDesignF: 10,
          policy: DEFAULT_SIZING_POLICY,
        });
        expect(check.withinRange).toBe(false);
      }
    }
  });
  it('the suggestion computes with no refused combination and explains each choice', () => {
    const r = computeDesign({ home: twoStorey, design: s.design, catalog, priceBook, pricing });
    expect(r.blockers.filter((b) => b.code === 'combination-refused')).toEqual([]);
    expect(s.reasons.length).toBeGreaterThanOrEqual(s.design.zones.length);
    for (const x of s.reasons) expect(x.text).toMatch(/Btu\/h at design for .* Btu\/h = \d+ % of the load/);
  });
});

describe('first price before leaving', () => {
  it('a range around the suggestion priced at short and long runs, marked preliminary', () => {
    const f = firstPrice({ home: twoStorey, models, priceBook, pricing });
    expect(f.range.preliminary).toBe(true);
    expect(f.range.lowCents).toBeLessThanOrEqual(f.result.price.totalCents);
    expect(f.range.highCents).toBeGreaterThanOrEqual(f.result.price.totalCents);
    expect(f.range.lowCents % 10000).toBe(0);
    expect(f.range.text).toMatch(/^about \$[\d,]+ – \$[\d,]+, subject to the estimator's review$/);
  });
});
