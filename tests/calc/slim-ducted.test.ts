import { describe, expect, it } from 'vitest';
import {
  catalogModelSchema,
  computeDesign,
  designCatalogFromModels,
  designPriceBookFromCompany,
  laborTaskSchema,
  type DesignInput,
  type HomeInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { priceBook, pricing, threeRoomHome } from './sample-data';

// What is checked here is the catalog's own word, not a trade figure: a slim ducted head and an air handler are two
// indoor types in the company's catalog, each mounted by the company's own labor task (its hours and rate); a heat
// kit is installed in the air handlers its catalog row lists as matched (the maker's match list; common practice:
// electric heat strips go in an air handler, a slim ducted head takes none). Both kinds move air through ducts, so
// both carry the walk-through's duct loads (ASHRAE 152, the method of calc/src/loads/ducts.ts).
const data = demoCompanyData();
const models = data.models.map((m) => catalogModelSchema.parse(m));
const demoCatalog = designCatalogFromModels(models);
const home: HomeInput = { ...threeRoomHome, ducts: { location: 'attic', insulationR: 6, leakage: 'typical' } };

const slim: DesignInput = {
  zones: [{ key: 'z1', name: 'Bedrooms', roomIds: ['bed', 'kitchen'], indoorUnitKey: 'TSL-S12H-D' }],
  systems: [
    {
      key: 's1',
      name: 'Slim ducted',
      outdoorUnitKey: 'TSL-S12H-O',
      circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
      electrical: { circuitLengthFt: 30 },
    },
  ],
};
const airHandler = (heatKitKey?: string): DesignInput => ({
  zones: [{ key: 'z1', name: 'House', roomIds: ['living', 'kitchen', 'bed'], indoorUnitKey: 'TSL-AH36' }],
  systems: [
    {
      key: 's1',
      name: 'Ducted',
      outdoorUnitKey: 'TSL-HP24',
      ...(heatKitKey ? { heatKitKey } : {}),
      circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
      electrical: { circuitLengthFt: 30 },
    },
  ],
});
const run = (design: DesignInput, book = priceBook) =>
  computeDesign({ home, design, catalog: demoCatalog, priceBook: book, pricing });

describe('a slim ducted head is not an air handler (issue 13)', () => {
  it('the engine keeps the catalog’s two ducted types apart', () => {
    const type = (key: string) => demoCatalog.indoorUnits.find((u) => u.key === key)?.unitType;
    expect(type('TSL-S12H-D')).toBe('slim-ducted');
    expect(type('TSL-MH15-D')).toBe('slim-ducted');
    expect(type('TSL-AH36')).toBe('ducted-air-handler');
  });

  it('a slim ducted head is mounted with the company’s slim ducted task, not the air handler’s', () => {
    // The company's own tasks: hanging a slim ducted unit 6 h at $95/h, setting an air handler 4 h at $80/h.
    const labor = data.labor.map((t) => {
      const row = laborTaskSchema.parse(t);
      if (row.key === 'mount-slim-ducted') return { ...row, hoursPerUnit: 6, rateCentsPerHour: 9500 };
      if (row.key === 'mount-air-handler') return { ...row, hoursPerUnit: 4, rateCentsPerHour: 8000 };
      return row;
    });
    const book = designPriceBookFromCompany({ models, labor });
    const mount = run(slim, book).takeoff.find((l) => l.itemKey.startsWith('labor:mount-indoor:'));
    expect(mount).toMatchObject({
      itemKey: 'labor:mount-indoor:slim-ducted',
      description: 'Mount indoor unit (slim ducted)',
      quantity: 6,
      unitCostCents: 9500,
      extendedCostCents: 6 * 9500,
    });
    expect(mount?.derivation).toContain('Hang a slim ducted unit and connect its duct');
    const handler = run(airHandler(), book).takeoff.find((l) => l.itemKey.startsWith('labor:mount-indoor:'));
    expect(handler).toMatchObject({
      itemKey: 'labor:mount-indoor:ducted-air-handler',
      quantity: 4,
      unitCostCents: 8000,
    });
  });

  it('still ducted: it carries the walk-through’s duct loads on the rooms it serves', () => {
    const r = run(slim);
    expect(r.loads.ductSystems.map((d) => d.roomIds)).toEqual([['bed', 'kitchen']]);
    expect(r.systems[0]?.explanations.some((e) => e.key === 's1:ducts')).toBe(true);
  });

  it('a heat kit goes only in an air handler its catalog row lists: refused on a slim ducted head or another handler', () => {
    const onSlim = run({ ...slim, systems: slim.systems.map((s) => ({ ...s, heatKitKey: 'TSL-HK5' })) });
    expect(onSlim.systems[0]?.combination.ok).toBe(false);
    const refusal =
      'TSL-HK5 (Tessaline 5 kW electric heat kit) is installed in an air handler it is listed for (TSL-AH36, TSL-AH60): Slim ducted has none.';
    expect(onSlim.systems[0]?.combination.refusals).toContain(refusal);
    expect(onSlim.blockers).toContainEqual({
      code: 'combination-refused',
      kind: 'combination',
      systemKey: 's1',
      message: refusal,
    });
    // The 10 kW kit is listed for the 60k handler only.
    const wrong = run(airHandler('TSL-HK10'));
    expect(wrong.systems[0]?.combination.refusals).toContain(
      'TSL-HK10 (Tessaline 10 kW electric heat kit) is installed in an air handler it is listed for (TSL-AH60): Ducted has none.',
    );
    const right = run(airHandler('TSL-HK5'));
    expect(right.systems[0]?.combination.ok).toBe(true);
    expect(right.blockers.filter((b) => b.kind === 'combination')).toEqual([]);
    // A kit listed for the ducted outdoor unit goes in that unit's air handler.
    const kits = (demoCatalog.heatKits ?? []).map((k) =>
      k.key === 'TSL-HK10' ? { ...k, fitsModelKeys: ['TSL-HP24'] } : k,
    );
    const byOutdoor = computeDesign({
      home,
      design: airHandler('TSL-HK10'),
      catalog: { ...demoCatalog, heatKits: kits },
      priceBook,
      pricing,
    });
    expect(byOutdoor.systems[0]?.combination.ok).toBe(true);
  });
});
