import { describe, expect, it } from 'vitest';
import {
  computeDesign,
  designCatalogFromModels,
  designPriceBookFromCompany,
  equipmentCatalogSchema,
  materialSchema,
  type DesignInput,
} from '@calc';
import { demoPriceBookRows } from './price-fixtures';
import { pricing, threeRoomHome } from './sample-data';

// A data mapping (issue 12 records → the engine's units): the checks compare each mapped field with the
// company record it came from; the trade figures themselves are the (invented) demo data.
const { data, models, materials, labor, kits, refrigerants } = demoPriceBookRows();
const catalog = designCatalogFromModels(models);

describe('catalog records → the design engine', () => {
  it('every active outdoor, indoor and heat-kit model maps to a unit the engine schema accepts', () => {
    expect(equipmentCatalogSchema.safeParse(catalog).success).toBe(true);
    const kinds = (k: string) => models.filter((m) => m.kind === k || m.kind.startsWith(k)).length;
    expect(catalog.outdoorUnits).toHaveLength(kinds('outdoor-'));
    expect(catalog.indoorUnits).toHaveLength(kinds('indoor'));
    expect(catalog.heatKits).toHaveLength(kinds('heat-kit'));
  });
  it('multi-zone keeps its ports, per-size adders, system-total pre-charge and height limit', () => {
    const src = models.find((m) => m.key === 'TSL-M36-4P');
    const u = catalog.outdoorUnits.find((o) => o.key === 'TSL-M36-4P');
    expect(u?.maxHeads).toBe(src?.ports);
    expect(u?.portSizesBtuh).toEqual(src?.portSizesBtuh);
    expect(u?.chargeAdders).toEqual(src?.chargeAdders);
    expect(u?.prechargeBasis).toBe('system-total');
    expect(u?.maxIndoorHeightDiffFt).toBe(src?.maxIndoorHeightDiffFt);
    expect(u?.equipmentType).toBe('heat-pump-variable-speed');
  });
  it("a single-zone head with no points of its own takes its pair's ratings", () => {
    const head = catalog.indoorUnits.find((i) => i.key === 'TSL-S12H-W');
    const pair = models.find((m) => m.key === 'TSL-S12H-O');
    expect(head?.cooling).toEqual(pair?.coolingPoints.map((p) => ({ outdoorF: p.outdoorF, btuh: p.btuh })));
  });
  it('every active multi-zone head carries its own cooling ratings, not a lone 95 °F nominal (issue 13)', () => {
    // A lone point made every design temperature but 95 °F "outside the maker's data" on the demo desk.
    for (const src of models.filter((m) => m.active && m.kind === 'indoor' && m.key.startsWith('TSL-MH'))) {
      const head = catalog.indoorUnits.find((i) => i.key === src.key);
      expect(src.coolingPoints.length, src.key).toBeGreaterThan(1);
      expect(head?.cooling, src.key).toEqual(src.coolingPoints.map((p) => ({ outdoorF: p.outdoorF, btuh: p.btuh })));
    }
  });
});

describe('price book records → the engine price book, then a full design', () => {
  const priceBook = designPriceBookFromCompany({
    models,
    materials,
    labor,
    kits,
    refrigerants,
    itemMap: { 'comm-cable:14-4': 'WIRE-14-4' },
  });
  const design: DesignInput = {
    zones: [
      { key: 'z-living', name: 'Living', roomIds: ['living', 'kitchen'], indoorUnitKey: 'TSL-MH12-W' },
      { key: 'z-bed', name: 'Bedroom', roomIds: ['bed'], indoorUnitKey: 'TSL-MH9-W' },
    ],
    systems: [
      {
        key: 's1',
        name: 'Main',
        outdoorUnitKey: 'TSL-M18-2P',
        circuits: [
          { zoneKey: 'z-living', lengthFt: 30 },
          { zoneKey: 'z-bed', lengthFt: 40 },
        ],
        electrical: { circuitLengthFt: 40 },
      },
    ],
  };
  const r = computeDesign({ home: threeRoomHome, design, catalog, priceBook, pricing });
  const line = (k: string) => r.takeoff.find((l) => l.itemKey === k);
  it('prices kits, refrigerant by the pound, labor by its task and mapped materials from the company rows', () => {
    expect(line('equipment:TSL-M18-2P')?.unitCostCents).toBe(models.find((m) => m.key === 'TSL-M18-2P')?.costCents);
    expect(line('line-set-kit:1/4x3/8:35ft')?.unitCostCents).toBe(
      data.kits.find((k) => k.key === 'LS-1438-35')?.costCents,
    );
    expect(line('comm-cable:14-4')?.unitCostCents).toBe(data.materials.find((m) => m.key === 'WIRE-14-4')?.costCents);
    expect(line('labor:electrical')?.unitCostCents).toBe(
      data.labor.find((t) => t.key === 'electrical-base')?.rateCentsPerHour,
    );
  });
  it('the system-total pre-charge (2 × 25 ft) is subtracted once from the installed kits (35 + 50 ft)', () => {
    // (35 + 50 − 50) ft × 0.2 oz/ft (the maker's 1/4 in adder) = 7.0 oz [reference §8 formula]
    expect(r.systems[0]?.refrigerant.extraChargeOz).toBe(7);
    expect(line('refrigerant:R-454B')?.quantity).toBe(0.44); // 7 oz ÷ 16 = 0.4375 → 0.44 lb
  });
});

describe('a material naming its takeoff item (issue 13)', () => {
  const mat = (key: string, costCents: number, takeoffItem?: string, active = true) =>
    materialSchema.parse({
      key,
      description: `Material ${key}`,
      unit: 'each',
      category: 'materials',
      costCents,
      active,
      ...(takeoffItem === undefined ? {} : { takeoffItem }),
    });
  it('prices the takeoff item it names, at its own cost and description', () => {
    const pb = designPriceBookFromCompany({ models: [], materials: [mat('WS-3', 790, 'wall-sleeve')] });
    expect(pb.items['wall-sleeve']).toEqual({ unitCostCents: 790, description: 'Material WS-3' });
    expect(pb.items['WS-3']?.unitCostCents).toBe(790);
  });
  it('an explicit itemMap wins over the field; the field wins over a SKU equal to the key', () => {
    const materials = [mat('wall-sleeve', 100), mat('WS-3', 790, 'wall-sleeve'), mat('WS-4', 950)];
    expect(designPriceBookFromCompany({ models: [], materials }).items['wall-sleeve']?.unitCostCents).toBe(790);
    const mapped = designPriceBookFromCompany({ models: [], materials, itemMap: { 'wall-sleeve': 'WS-4' } });
    expect(mapped.items['wall-sleeve']?.unitCostCents).toBe(950);
    // With no field at all, the SKU-equals-key rule still prices it.
    expect(
      designPriceBookFromCompany({ models: [], materials: [mat('wall-sleeve', 100)] }).items['wall-sleeve']
        ?.unitCostCents,
    ).toBe(100);
  });
  it('an active material is preferred over a retired one naming the same item', () => {
    const pb = designPriceBookFromCompany({
      models: [],
      materials: [mat('OLD', 500, 'wire:nm-b:10awg', false), mat('NEW', 145, 'wire:nm-b:10awg')],
    });
    expect(pb.items['wire:nm-b:10awg']?.unitCostCents).toBe(145);
  });
  it('the field is checked with the key rule', () => {
    const bad = materialSchema.safeParse({
      key: 'WS-3',
      description: 'Wall sleeve',
      unit: 'each',
      category: 'materials',
      costCents: 790,
      takeoffItem: 'wall sleeve',
    });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toBe(
      'Takeoff item may use letters, digits, dots, dashes, slashes and colons only',
    );
  });
  it('the demo price book leaves no takeoff line of the sample design unpriced', () => {
    const priceBook = designPriceBookFromCompany({
      models,
      materials,
      labor,
      kits,
      refrigerants,
    });
    const design: DesignInput = {
      zones: [{ key: 'z-living', name: 'Living', roomIds: ['living', 'kitchen', 'bed'], indoorUnitKey: 'TSL-MH12-W' }],
      systems: [
        {
          key: 's1',
          name: 'Main',
          outdoorUnitKey: 'TSL-M18-2P',
          circuits: [{ zoneKey: 'z-living', lengthFt: 30, wallPenetrations: 1, condensateLengthFt: 12 }],
          electrical: { circuitLengthFt: 40 },
        },
      ],
    };
    const r = computeDesign({ home: threeRoomHome, design, catalog, priceBook, pricing });
    expect(r.warnings.filter((w) => w.startsWith('No price for'))).toEqual([]);
    expect(r.takeoff.find((l) => l.itemKey === 'wall-sleeve')?.unitCostCents).toBe(
      data.materials.find((m) => m.key === 'WS-3')?.costCents,
    );
  });
});
