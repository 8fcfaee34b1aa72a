import { describe, expect, it } from 'vitest';
import {
  catalogModelSchema,
  coincidentLoad,
  computeDesign,
  designCatalogFromModels,
  homeLoad,
  type DesignInput,
  type HomeInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { priceBook, pricing, threeRoomHome } from './sample-data';

// Sources: the duct loads are ASHRAE Standard 152's (delivery effectiveness; the method in calc/src/loads/ducts.ts,
// checked in ducts.test.ts against an energy balance marched through the ducts), worked once for the one set of
// ducts the walk-through recorded and shared among the rooms they serve by each room's own gain and loss (the
// sharing rule stated in calc/src/loads/home-ducts.ts; common practice). Several systems on those ducts take the
// shares of their own rooms, so the systems' parts add up to the one-system figure for the whole house.
const data = demoCompanyData();
const demoCatalog = designCatalogFromModels(data.models.map((m) => catalogModelSchema.parse(m)));
const home: HomeInput = { ...threeRoomHome, ducts: { location: 'attic', insulationR: 6, leakage: 'typical' } };
const run = (design: DesignInput) => computeDesign({ home, design, catalog: demoCatalog, priceBook, pricing });

const system = (key: string, name: string, zoneKey: string): DesignInput['systems'][number] => ({
  key,
  name,
  outdoorUnitKey: 'TSL-HP24',
  circuits: [{ zoneKey, lengthFt: 25 }],
  electrical: { circuitLengthFt: 40 },
});
/** One air handler on the walk-through's ducts for the whole house. */
const one: DesignInput = {
  zones: [{ key: 'z1', name: 'House', roomIds: ['living', 'kitchen', 'bed'], indoorUnitKey: 'TSL-AH36' }],
  systems: [system('s1', 'Whole house', 'z1')],
};
/** Two air handlers, neither with ducts of its own: both on the walk-through's ducts, each for its rooms. */
const two: DesignInput = {
  zones: [
    { key: 'z1', name: 'Day rooms', roomIds: ['living', 'kitchen'], indoorUnitKey: 'TSL-AH36' },
    { key: 'z2', name: 'Bedroom', roomIds: ['bed'], indoorUnitKey: 'TSL-AH36' },
  ],
  systems: [system('s1', 'Day side', 'z1'), system('s2', 'Night side', 'z2')],
};
const inputOf = (e: { inputs: readonly { label: string; value: number }[] } | undefined, label: string) =>
  e?.inputs.find((i) => i.label === label)?.value ?? Number.NaN;

describe('several ducted systems on the walk-through’s one set of ducts (issue 13)', () => {
  it('the ducts’ loads are worked once for all their rooms: each system sizes on its own rooms’ share, none twice', () => {
    const r1 = run(one);
    const r2 = run(two);
    // The same rooms on the same ducts: the same loads as the walk-through's home with them.
    expect(r2.loads).toEqual(homeLoad({ home }));
    expect(r2.loads.ductSystems).toHaveLength(1);
    // Each system's load is the coincident load of its own rooms (with their duct shares); the two heat losses add
    // up to the one system's for the whole house — the walk-through's ducts' loss is in it once.
    const [day, night] = r2.systems;
    expect(day?.sizing.heatingLoadBtuh).toBe(
      coincidentLoad({ loads: r2.loads, roomIds: ['living', 'kitchen'] }).heatingBtuh,
    );
    expect((day?.sizing.heatingLoadBtuh ?? 0) + (night?.sizing.heatingLoadBtuh ?? 0)).toBe(
      r1.systems[0]?.sizing.heatingLoadBtuh,
    );
  });

  it('each system explains its own rooms’ share, and the shares add up to the one-system figure for the whole house', () => {
    const whole = run(one).systems[0]?.explanations.find((e) => e.key === 's1:ducts');
    const ducts = homeLoad({ home }).ducts;
    expect(whole?.value).toBe(Math.round(ducts?.cooling.sensibleBtuh ?? Number.NaN));
    const r2 = run(two);
    const parts = r2.systems.map((s) => s.explanations.find((e) => e.key === `${s.systemKey}:ducts`));
    // Both systems run on the ducts, so both say so (before: only the first, with the whole set's figures).
    expect(parts.map((p) => p?.label)).toEqual([
      'Duct loads, Day side (ducts in the attic, R-6)',
      'Duct loads, Night side (ducts in the attic, R-6)',
    ]);
    const sum = (label: string) => parts.reduce((t, p) => t + inputOf(p, label), 0);
    expect(parts.reduce((t, p) => t + (p?.value ?? 0), 0)).toBe(whole?.value);
    expect(sum('Sensible gain, this system’s rooms')).toBe(Math.round(ducts?.cooling.sensibleBtuh ?? Number.NaN));
    expect(sum('Latent gain, this system’s rooms')).toBe(Math.round(ducts?.cooling.latentBtuh ?? Number.NaN));
    expect(sum('Heat loss, this system’s rooms')).toBe(Math.round(ducts?.heating.btuh ?? Number.NaN));
    // Each share is its rooms' own: the latent and heating parts the load method gave those rooms.
    const rooms = new Map(r2.loads.rooms.map((r) => [r.roomId, r]));
    const own = (ids: string[], f: (id: string) => number) => ids.reduce((t, id) => t + f(id), 0);
    expect(inputOf(parts[1], 'Heat loss, this system’s rooms')).toBe(
      own(['bed'], (id) => rooms.get(id)?.heatLoss.ducts ?? 0),
    );
    expect(inputOf(parts[0], 'Latent gain, this system’s rooms')).toBe(
      own(['living', 'kitchen'], (id) => rooms.get(id)?.latentGain.ducts ?? 0),
    );
    expect(parts[1]?.text).toContain('the walk-through’s ducts serve the rooms of 2 systems');
    expect(parts[1]?.text).toContain(
      `of their ${Math.round(ducts?.heating.btuh ?? 0).toLocaleString('en-US')} Btu/h heat loss`,
    );
  });

  it('one ducted system keeps the whole set’s figures, as before', () => {
    const why = run(one).systems[0]?.explanations.find((e) => e.key === 's1:ducts');
    expect(why?.text).not.toContain('this system’s rooms');
    expect(why?.inputs.map((i) => i.label)).not.toContain('Heat loss, this system’s rooms');
  });
});
