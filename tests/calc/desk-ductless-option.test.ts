import { describe, expect, it } from 'vitest';
import {
  isDuctedUnit,
  catalogModelSchema,
  computeDesign,
  designCatalogFromModels,
  designPriceBookFromCompany,
  homeLoad,
  suggestDesign,
  type DesignInput,
  type HomeInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { DEMO_DESIGN_DEFAULTS, DUCTED_HOME, DUCTED_HOUSE } from '../../fixtures/demo-homes';
import { pricing } from './sample-data';

// Issue 13: an option's loads count the ducts of the distribution system it uses. ASHRAE Standard 152 works the
// duct losses of the distribution system in use (its delivery effectiveness is that system's); ducts no system of
// the option blows air through add no gain or loss (common practice: the clause is not cited here). The reference
// for the no-duct case is the engine's own load method on the same home with its ducts removed (its figures are
// checked against their sources in the loads tests); the ducted case against the same method with the ducts kept.
const models = demoCompanyData().models.map((m) => catalogModelSchema.parse(m));
const catalog = designCatalogFromModels(models);
const priceBook = designPriceBookFromCompany({ models });
const run = (home: HomeInput, design: DesignInput) => computeDesign({ home, design, catalog, priceBook, pricing });

// The demo ranch of fixtures/demo-jobs.ts: attic ducts, R-6, tested leakage 8 % supply / 6 % return.
const ranch: HomeInput = {
  id: 'demo-ranch',
  designConditions: DEMO_DESIGN_DEFAULTS,
  tightness: 'average',
  ...DUCTED_HOUSE,
  rooms: DUCTED_HOME.map((r, i) => ({ ...r, id: `room-${i + 1}` })),
};
const { ducts: _ducts, ...withoutDucts } = ranch;
const bare: HomeInput = withoutDucts;
/** A ductless option: what suggest proposes from the catalog's ductless heads (no air handler, no slim ducted head). */
const ductless = suggestDesign({
  home: bare,
  models: models.filter(
    (m) => m.indoorType !== 'slim-ducted' && m.indoorType !== 'air-handler' && m.kind !== 'outdoor-ducted',
  ),
}).design;
/** A ducted option: suggest's plan on the ranch (the heat pump with its air handler on the home's ducts). */
const ducted = suggestDesign({ home: ranch, models }).design;
const ductedKeys = new Set(catalog.indoorUnits.filter(isDuctedUnit).map((u) => u.key));
const figures = (r: ReturnType<typeof run>) =>
  r.zones.map(
    (z) =>
      `${z.name}: cooling ${z.sizing.coolingLoadBtuh}, heating ${z.sizing.heatingLoadBtuh} (${Math.round((z.sizing.coolingRatio ?? 0) * 1000) / 10} %)`,
  );

describe('a ductless option on a house with ducts has no duct loads (issue 13)', () => {
  it('the ductless option’s loads are the home’s loads with its ducts removed, zone by zone', () => {
    expect(ductless.zones.length).toBeGreaterThan(0);
    expect(ductless.zones.some((z) => ductedKeys.has(z.indoorUnitKey))).toBe(false);
    console.info(
      `[ductless plan] ${ductless.systems.map((s) => `${s.outdoorUnitKey}: ${s.circuits.map((c) => ductless.zones.find((z) => z.key === c.zoneKey)?.indoorUnitKey).join(', ')}`).join('; ')}`,
    );
    const onRanch = run(ranch, ductless);
    expect(onRanch.loads.ducts).toBeNull();
    expect(onRanch.loads).toEqual(homeLoad({ home: bare }));
    expect(onRanch.zones).toEqual(run(bare, ductless).zones);
    expect(onRanch.systems.map((s) => s.sizing)).toEqual(run(bare, ductless).systems.map((s) => s.sizing));
    // No duct line is explained on a ductless option.
    expect(onRanch.systems.flatMap((s) => s.explanations).some((e) => e.key.endsWith(':ducts'))).toBe(false);
    console.info(`[demo ranch, ductless option] ${figures(onRanch).join('; ')}`);
  });

  it('the ducted option keeps the walk-through’s ducts on the rooms its ducted unit serves, and says so', () => {
    expect(ducted.zones.some((z) => ductedKeys.has(z.indoorUnitKey))).toBe(true);
    const r = run(ranch, ducted);
    const walked = homeLoad({ home: ranch });
    expect(r.loads).toEqual(walked);
    expect(r.loads.ducts?.location).toBe('attic');
    // Attic ducts in summer add gain (ASHRAE 152: attic air above the indoor temperature): more than the bare house.
    expect(r.loads.block.sensibleBtuh).toBeGreaterThan(homeLoad({ home: bare }).block.sensibleBtuh);
    const system = r.systems.find((s) => s.explanations.some((e) => e.key === `${s.systemKey}:ducts`));
    const why = system?.explanations.find((e) => e.key.endsWith(':ducts'));
    expect(why?.value).toBe(Math.round(walked.ducts?.cooling.sensibleBtuh ?? Number.NaN));
    // The walk-through's tested fractions are said to come from the walk-through, not from the tightness defaults.
    expect(why?.text).toContain('supply 0.08 tested (as entered on the walk-through)');
    console.info(`[demo ranch, ducted option] ${figures(r).join('; ')}`);
  });

  it('a ducted unit on only some rooms carries the walk-through’s ducts for those rooms alone', () => {
    const [first] = ducted.zones;
    const [system] = ducted.systems;
    const circuit = system?.circuits[0];
    const walkedDucts = DUCTED_HOUSE.ducts;
    if (!first || !system || !circuit || !walkedDucts) throw new Error('suggest gave the ducted ranch a ducted system');
    const rooms = ranch.rooms.slice(0, 3).map((r) => r.id);
    const part: DesignInput = {
      zones: [{ ...first, roomIds: rooms, headRoomId: undefined }],
      systems: [{ ...system, circuits: [{ ...circuit, zoneKey: first.key }] }],
    };
    const r = run(ranch, part);
    expect(r.loads).toEqual(homeLoad({ home: { ...ranch, ducts: { ...walkedDucts, roomIds: rooms } } }));
    expect(r.loads.ducts?.roomIds).toEqual(rooms);
  });
});
