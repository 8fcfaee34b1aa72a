import { describe, expect, it } from 'vitest';
import { CalcError, computeDesign, homeLoad, type DesignInput, type HomeInput } from '@calc';
import { catalog, design, priceBook, pricing, threeRoomHome } from './sample-data';

/** The sample design with its one system ducted (as an air handler's would be). */
const ducted = (ducts: NonNullable<DesignInput['systems'][number]['ducts']>): DesignInput => ({
  ...design,
  systems: design.systems.map((s) => ({ ...s, ducts })),
});
const run = (d: DesignInput, home: HomeInput = threeRoomHome) =>
  computeDesign({ home, design: d, catalog, priceBook, pricing });
const allRooms = ['living', 'bed', 'kitchen'];

describe('a ducted system’s ducts feed this option’s loads', () => {
  it('attic ducts on the system give the loads of the duct method with those ducts on the rooms the system serves', () => {
    const ducts = { location: 'attic' as const, insulationR: 6, leakage: 'typical' as const };
    const withDucts = run(ducted(ducts));
    // The same ducts entered on the walk-through's home for the same rooms: the method checked in ducts.test.ts
    // (ASHRAE 152 delivery effectiveness against an energy balance marched through the ducts).
    // The zones' loads are summed from these (zone-loads.ts).
    expect(withDucts.loads).toEqual(homeLoad({ home: { ...threeRoomHome, ducts: { ...ducts, roomIds: allRooms } } }));
    // Attic air above the outdoor design temperature in the afternoon (ASHRAE 152): the ducts add gain.
    const bare = run(design);
    expect(withDucts.loads.block.sensibleBtuh).toBeGreaterThan(bare.loads.block.sensibleBtuh);
    // The desk's line says the duct figures of the method, on the system.
    const method = homeLoad({ home: { ...threeRoomHome, ducts: { ...ducts, roomIds: allRooms } } }).ducts;
    const why = withDucts.systems[0]?.explanations.find((e) => e.key === 's1:ducts');
    expect(why?.value).toBe(Math.round(method?.cooling.sensibleBtuh ?? Number.NaN));
    expect(why?.label).toBe('Duct loads, Main system (ducts in the attic, R-6)');
    expect(why?.status).toBe('note');
  });

  it('ducts inside the conditioned space change nothing (ASHRAE 152: what they lose stays in the house)', () => {
    const inside = run(ducted({ location: 'conditioned', insulationR: 6, leakage: 'typical' }));
    expect(inside.zones).toEqual(run(design).zones);
  });

  it('the option’s ducts stand in for the walk-through’s; a ductless option has no duct loads', () => {
    const home = { ...threeRoomHome, ducts: { location: 'garage' as const, insulationR: 4 } };
    const attic = { location: 'attic' as const, insulationR: 8, leakage: 'sealed' as const };
    expect(run(ducted(attic), home).loads).toEqual(
      homeLoad({ home: { ...threeRoomHome, ducts: { ...attic, roomIds: allRooms } } }),
    );
    // Wall heads only: no air moves through the walk-through's ducts, so they add nothing (ASHRAE 152 counts the
    // losses of the distribution system in use; common practice) — the loads of the home without them.
    expect(run(design, home).loads.ducts).toBeNull();
    expect(run(design, home).zones).toEqual(run(design).zones);
  });

  it('two ducted systems, each on its own rooms: each system’s duct loads are the one-system method’s for its rooms alone', () => {
    const [first] = design.systems;
    if (!first) throw new Error('sample design has a system');
    const attic = { location: 'attic' as const, insulationR: 6, leakage: 'typical' as const };
    const basement = { location: 'basement' as const, insulationR: 4, leakage: 'leaky' as const };
    const two: DesignInput = {
      ...design,
      systems: [
        { ...first, circuits: first.circuits.slice(0, 1), ducts: attic },
        { ...first, key: 's2', name: 'Downstairs', circuits: first.circuits.slice(1), ducts: basement },
      ],
    };
    const r = run(two);
    // The reference: the one-system method (ASHRAE 152 delivery effectiveness, checked in ducts.test.ts against
    // an energy balance marched through the ducts) with only that system's ducts, on only its rooms.
    const up = homeLoad({ home: { ...threeRoomHome, ducts: { ...attic, roomIds: ['living', 'kitchen'] } } });
    const down = homeLoad({ home: { ...threeRoomHome, ducts: { ...basement, roomIds: ['bed'] } } });
    expect(r.loads.ductSystems.map((d) => [d.location, d.roomIds])).toEqual([
      ['attic', ['living', 'kitchen']],
      ['basement', ['bed']],
    ]);
    const [mine1, mine2] = r.loads.ductSystems;
    for (const [mine, alone] of [
      [mine1, up.ducts],
      [mine2, down.ducts],
    ] as const) {
      // Heating loss and latent gain are the system's own rooms' (at their own peak), whatever the other system does.
      expect(mine?.heating).toEqual(alone?.heating);
      expect(mine?.cooling.latentBtuh).toBe(alone?.cooling.latentBtuh);
      expect(mine?.airflowCfm).toBe(alone?.airflowCfm);
      expect(mine?.supplyLeakageFraction).toBe(alone?.supplyLeakageFraction);
    }
    // Each room's duct shares (at its own peak hour) are those of its own system's method alone.
    const room = (l: typeof up, id: string) => l.rooms.find((x) => x.roomId === id);
    for (const [id, alone] of [
      ['living', up],
      ['kitchen', up],
      ['bed', down],
    ] as const) {
      expect(room(r.loads, id)?.sensibleGain.ducts, id).toBe(room(alone, id)?.sensibleGain.ducts);
      expect(room(r.loads, id)?.latentGain.ducts, id).toBe(room(alone, id)?.latentGain.ducts);
      expect(room(r.loads, id)?.heatLoss.ducts, id).toBe(room(alone, id)?.heatLoss.ducts);
      expect(room(alone, id)?.heatLoss.ducts, `${id} has duct loss`).toBeGreaterThan(0);
    }
    // The desk's line on each system says its own figures, at the whole option's block hour.
    const why1 = r.systems[0]?.explanations.find((e) => e.key === 's1:ducts');
    const why2 = r.systems[1]?.explanations.find((e) => e.key === 's2:ducts');
    expect(why1?.label).toBe('Duct loads, Main system (ducts in the attic, R-6)');
    expect(why2?.label).toBe('Duct loads, Downstairs (ducts in an unheated basement, R-4)');
    expect(why1?.value).toBe(Math.round(mine1?.cooling.sensibleBtuh ?? Number.NaN));
    expect(why2?.value).toBe(Math.round(mine2?.cooling.sensibleBtuh ?? Number.NaN));
    expect(r.systems[1]?.explanations.some((e) => e.key === 's1:ducts')).toBe(false);
  });

  it('refuses a room on two ducted systems’ ducts, on the second one’s ducts', () => {
    const [first] = design.systems;
    if (!first) throw new Error('sample design has a system');
    const two: DesignInput = {
      ...design,
      systems: [
        { ...first, circuits: first.circuits.slice(0, 1), ducts: { location: 'attic' } },
        { ...first, key: 's2', name: 'Second', ducts: { location: 'garage' } },
      ],
    };
    let thrown: unknown;
    try {
      run(two);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(CalcError);
    expect((thrown as CalcError).details).toEqual([
      {
        path: ['systems', 1, 'ducts'],
        message: 'Room "living" is already served by the ducts of Main system: a room is on one ducted system\'s ducts',
      },
    ]);
  });
});

describe('tested duct leakage on a ducted system (issue 13)', () => {
  const tested = {
    location: 'attic' as const,
    insulationR: 6,
    leakage: 'typical' as const,
    supplyLeakageFraction: 0.06,
    returnLeakageFraction: 0.04,
    leakageTest: '2026-11-12, leakage to outside at 25 Pa',
  };
  const problems = (ducts: Record<string, unknown>) => {
    try {
      run(ducted(ducts as never));
    } catch (e) {
      if (e instanceof CalcError) return e.details.map((d) => `${d.path.join('.')}: ${d.message}`);
      throw e;
    }
    return [];
  };

  it('the tested fractions are used instead of the tightness’s defaults: the method with those fractions', () => {
    const r = run(ducted(tested));
    // The same fractions on the walk-through's ducts (the method checked in ducts.test.ts against an energy
    // balance marched through the ducts, ASHRAE 152 delivery effectiveness).
    const { leakageTest: _words, ...fractions } = tested;
    const method = homeLoad({ home: { ...threeRoomHome, ducts: { ...fractions, roomIds: allRooms } } }).ducts;
    expect(r.loads.ducts?.supplyLeakageFraction).toBe(0.06);
    expect(r.loads.ducts?.returnLeakageFraction).toBe(0.04);
    expect(r.loads.ducts?.cooling.sensibleBtuh).toBe(method?.cooling.sensibleBtuh);
    // Tighter than the "typical" defaults: less supply air lost to the attic, a smaller duct gain (ASHRAE 152:
    // the delivered share of the supply falls with its leakage fraction).
    const typical = run(ducted({ location: 'attic', insulationR: 6, leakage: 'typical' }));
    expect(r.loads.ducts?.cooling.sensibleBtuh).toBeLessThan(typical.loads.ducts?.cooling.sensibleBtuh ?? 0);
    const why = r.systems[0]?.explanations.find((e) => e.key === 's1:ducts');
    expect(why?.text).toContain('supply 0.06 tested (2026-11-12, leakage to outside at 25 Pa)');
    expect(why?.text).toContain('return 0.04 tested');
    expect(typical.systems[0]?.explanations.find((e) => e.key === 's1:ducts')?.text).toContain(
      'the "typical" defaults (common practice, from memory)',
    );
  });

  it('one fraction tested: the other keeps the default and says so', () => {
    const r = run(ducted({ ...tested, returnLeakageFraction: undefined }));
    const why = r.systems[0]?.explanations.find((e) => e.key === 's1:ducts')?.text ?? '';
    expect(why).toContain('supply 0.06 tested');
    expect(why).toMatch(/return 0\.\d\d from the "typical" defaults/);
  });

  it('clear errors: the bounds of calc’s duct schema, and the test named whenever a fraction is entered', () => {
    expect(problems({ ...tested, supplyLeakageFraction: 0.6 })).toEqual([
      'systems.0.ducts.supplyLeakageFraction: Supply duct leakage must be between 0 and 0.5',
    ]);
    expect(problems({ ...tested, leakageTest: undefined })).toEqual([
      'systems.0.ducts.leakageTest: Say when and how the ducts were tested (date and method)',
    ]);
    expect(problems({ location: 'attic', leakageTest: '2026-11-12' })).toEqual([
      'systems.0.ducts.supplyLeakageFraction: Enter the tested supply or return leakage, or clear the test',
    ]);
  });
});
