import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  designConditionsSchema,
  ductSystemSchema,
  homeInputSchema,
  homeLoadFromParsed,
  liveHome,
  roomInputSchema,
  ventilationSchema,
  type Home,
  type Room,
} from '@calc';
import { ranchHome } from './ranch-home';

/**
 * The per-keystroke path against the full recompute. Source of truth: `homeLoadFromParsed`, the
 * whole-home recompute the server runs, whose duct terms are the ASHRAE Standard 152 design
 * delivery-effectiveness balance checked in ducts.test.ts against an energy balance marched through
 * the ducts. The live path must give the very same figures, duct shares included, while working
 * out only the rooms whose hours changed.
 */

/** The review ranch with its ducts in the attic: R-6, typical 10 %/10 % leakage (issue 9's note). */
const ducted: Home = homeInputSchema.parse({
  ...ranchHome,
  ducts: { location: 'attic', insulationR: 6, leakage: 'typical', roofColor: 'dark' },
});

const withRoom = (home: Home, room: Room): Home => ({
  ...home,
  rooms: home.rooms.map((r) => (r.id === room.id ? room : r)),
});

const edit = (room: Room, change: Record<string, unknown>): Room => roomInputSchema.parse({ ...room, ...change });

function roomOf(home: Home, id: string): Room {
  const r = home.rooms.find((x) => x.id === id);
  if (!r) throw new Error(`no room ${id}`);
  return r;
}

describe('live home (per keystroke) equals the full recompute', () => {
  it('a ducted home: first call, a window edit (one room redone) and a wall-length edit (house air moves)', () => {
    const live = liveHome();
    const first = live.load(ducted);
    expect(first).toEqual(homeLoadFromParsed(ducted));
    expect(live.lastRecomputed).toBe(ducted.rooms.length);
    // The duct share is in the live figure of every served room.
    for (const r of first.rooms) expect(r.sensibleGain.ducts, r.roomName).toBeGreaterThan(0);
    expect(first.ducts?.location).toBe('attic');

    // More glass in the living room: its own hours change; the house's leakage, ventilation and
    // internal shares do not (the envelope is gross wall area), so only this room is worked again.
    const living = roomOf(ducted, 'living');
    const wider = edit(living, {
      exposedWalls: living.exposedWalls.map((w, i) =>
        i === 0 ? { ...w, windows: [{ areaFt2: 80, glazing: 'double-clear' }] } : w,
      ),
    });
    const home2 = withRoom(ducted, wider);
    const second = live.load(home2);
    expect(live.lastRecomputed).toBe(1);
    const full2 = homeLoadFromParsed(home2);
    expect(second).toEqual(full2);
    // What the room editor asks for: the one room's figures, the same as the full recompute's.
    expect(live.room(home2, 'living')).toEqual(full2.rooms.find((r) => r.roomId === 'living'));
    expect(live.lastRecomputed).toBe(0);
    // The edited room's duct share moved with its gain (shares follow each room's sensible gain each hour).
    const liveLiving = second.rooms.find((r) => r.roomId === 'living');
    expect(liveLiving?.sensibleGain.ducts).toBe(full2.rooms.find((r) => r.roomId === 'living')?.sensibleGain.ducts);
    expect(liveLiving?.sensibleGain.ducts).not.toBe(first.rooms.find((r) => r.roomId === 'living')?.sensibleGain.ducts);

    // A longer outside wall under the tightness: the room's leakage is its own exposed surface × the unit leakage
    // area (ASHRAE Fundamentals 2021 ch. 17 eq. (9)), so that room alone is redone.
    const longer = edit(wider, { exposedWalls: wider.exposedWalls.map((w) => ({ ...w, lengthFt: 22 })) });
    const home3 = withRoom(home2, longer);
    expect(live.load(home3)).toEqual(homeLoadFromParsed(home3));
    expect(live.lastRecomputed).toBe(1);
    // With a blower-door figure the house's leakage is shared by exposed surface, so a longer wall moves every
    // outside room's share.
    const tested = { ...home3, blowerDoorCfm50: 1500 };
    expect(live.load(tested)).toEqual(homeLoadFromParsed(tested));
    const tested2 = withRoom(
      tested,
      edit(longer, { exposedWalls: longer.exposedWalls.map((w) => ({ ...w, lengthFt: 24 })) }),
    );
    expect(live.load(tested2)).toEqual(homeLoadFromParsed(tested2));
    const outside = tested2.rooms.filter((r) => r.exposedWalls.length > 0 || r.above.kind !== 'conditioned').length;
    expect(live.lastRecomputed).toBe(outside);
  });

  it('no ducts, then ducts added, then the design conditions changed: always the full figures', () => {
    const live = liveHome();
    // The same parsed rooms without the ducted system (the walk-through keeps each parsed room).
    const plain: Home = { ...ducted, ducts: undefined };
    expect(live.load(plain)).toEqual(homeLoadFromParsed(plain));
    expect(live.load(ducted)).toEqual(homeLoadFromParsed(ducted));
    // the hours are kept (same rooms, same air): only the ducts were added
    expect(live.lastRecomputed).toBe(0);
    const hotter: Home = { ...ducted, designConditions: { ...ducted.designConditions, outdoorCoolingDryBulbF: 100 } };
    expect(live.load(hotter)).toEqual(homeLoadFromParsed(hotter));
    expect(live.lastRecomputed).toBe(ducted.rooms.length);
  });

  it('property: any sequence of room edits on a ducted home gives the full recompute’s figures', () => {
    const ids = ducted.rooms.map((r) => r.id);
    const anEdit = fc.record({
      id: fc.constantFrom(...ids),
      glass: fc.integer({ min: 0, max: 40 }),
      wallFt: fc.integer({ min: 8, max: 30 }),
      occupants: fc.integer({ min: 0, max: 4 }),
      color: fc.constantFrom('light', 'medium', 'dark'),
    });
    fc.assert(
      fc.property(fc.array(anEdit, { minLength: 1, maxLength: 6 }), (edits) => {
        const live = liveHome();
        let home = ducted;
        live.load(home);
        for (const e of edits) {
          const r = roomOf(home, e.id);
          const walls = r.exposedWalls.length > 0 ? r.exposedWalls : [];
          home = withRoom(
            home,
            edit(r, {
              occupants: e.occupants,
              exposedWalls: walls.map((w, i) =>
                i === 0
                  ? {
                      ...w,
                      lengthFt: e.wallFt,
                      color: e.color,
                      windows: [{ areaFt2: e.glass + 1, glazing: 'double-clear' }],
                    }
                  : w,
              ),
            }),
          );
          const full = homeLoadFromParsed(home);
          expect(live.room(home, e.id)).toEqual(full.rooms.find((r) => r.roomId === e.id));
          expect(live.load(home)).toEqual(full);
        }
      }),
      { numRuns: 25 },
    );
    // A generous limit: the machine that runs the suite may be busy (this is not a speed check).
  }, 60_000);

  it('property: random sequences of house and room edits on ducted homes (rooms added and removed, tightness, ducts, ventilation)', () => {
    // Each step changes one thing as the walk-through would (unchanged rooms keep their parsed objects),
    // then every room's live figures and the whole home's must be the full recompute's, duct shares and
    // block hour included. The figures are integers (each part rounded to 1 Btu/h), so equal means equal.
    const roomArb = fc.record({
      name: fc.constantFrom('Bedroom', 'Kitchen', 'Den', 'Bath', 'Office'),
      lengthFt: fc.integer({ min: 6, max: 30 }),
      widthFt: fc.integer({ min: 6, max: 24 }),
      direction: fc.constantFrom('N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'),
      glass: fc.integer({ min: 0, max: 60 }),
      overhangFt: fc.constantFrom(0, 0, 2),
      above: fc.constantFrom('attic', 'conditioned', 'roof'),
      below: fc.constantFrom('slab', 'crawlspace', 'garage'),
      occupants: fc.constantFrom(0, 0, 0, 2),
      achOverride: fc.constantFrom(undefined, undefined, 0.5),
    });
    type RoomSpec = typeof roomArb extends fc.Arbitrary<infer T> ? T : never;
    let serial = 0;
    const newRoom = (r: RoomSpec): Room => {
      serial += 1;
      return roomInputSchema.parse({
        id: `added-${serial}`,
        name: `${r.name} ${serial}`,
        lengthFt: r.lengthFt,
        widthFt: r.widthFt,
        ceilingHeightFt: 8,
        exposedWalls:
          r.glass === 0 && r.above === 'conditioned'
            ? []
            : [
                {
                  direction: r.direction,
                  lengthFt: r.lengthFt,
                  windows:
                    r.glass > 0
                      ? [
                          {
                            widthIn: 36,
                            heightIn: 48,
                            count: 1 + (r.glass % 3),
                            glazing: 'double-clear',
                            ...(r.overhangFt > 0 ? { overhangDepthFt: r.overhangFt, overhangGapFt: 1 } : {}),
                          },
                        ]
                      : [],
                },
              ],
        above: r.above === 'conditioned' ? { kind: 'conditioned' } : { kind: r.above, insulation: 'r30' },
        below:
          r.below === 'slab'
            ? { kind: 'slab', edgeInsulated: false }
            : r.below === 'garage'
              ? { kind: 'garage', insulation: 'r19' }
              : { kind: 'crawlspace', vented: true, insulation: 'r19' },
        occupants: r.occupants,
        ...(r.achOverride !== undefined ? { achOverride: r.achOverride } : {}),
      });
    };
    const ductsArb = fc.option(
      fc.record({
        location: fc.constantFrom('attic', 'crawlspace', 'garage', 'basement', 'conditioned'),
        insulationR: fc.constantFrom(0, 4, 6, 8),
        leakage: fc.constantFrom('sealed', 'typical', 'leaky'),
        roofColor: fc.constantFrom('light', 'medium', 'dark'),
        radiantBarrier: fc.boolean(),
        airflowCfm: fc.option(fc.integer({ min: 400, max: 2000 }), { nil: undefined }),
        someRooms: fc.boolean(),
      }),
      { nil: undefined },
    );
    const step = fc.oneof(
      fc.record({
        kind: fc.constant('edit' as const),
        at: fc.nat(),
        glass: fc.integer({ min: 0, max: 40 }),
        wallFt: fc.integer({ min: 8, max: 30 }),
        occupants: fc.integer({ min: 0, max: 4 }),
        color: fc.constantFrom('light', 'medium', 'dark'),
      }),
      fc.record({ kind: fc.constant('add' as const), room: roomArb }),
      fc.record({ kind: fc.constant('remove' as const), at: fc.nat() }),
      fc.record({
        kind: fc.constant('tightness' as const),
        tightness: fc.constantFrom('very-tight', 'tight', 'average', 'leaky', 'very-leaky'),
        blowerDoor: fc.option(fc.integer({ min: 800, max: 4000 }), { nil: undefined }),
      }),
      fc.record({ kind: fc.constant('ducts' as const), ducts: ductsArb }),
      // Two ducted systems (an option's attic and basement air handlers): each on its own rooms.
      fc.record({ kind: fc.constant('two-ducts' as const), upstairs: ductsArb, downstairs: ductsArb }),
      fc.record({
        kind: fc.constant('ventilation' as const),
        vent: fc.constantFrom('none', 'exhaust', 'supply', 'balanced', 'erv-hrv'),
        bedrooms: fc.option(fc.integer({ min: 1, max: 5 }), { nil: undefined }),
      }),
      fc.record({ kind: fc.constant('conditions' as const), hotter: fc.integer({ min: 0, max: 8 }) }),
    );
    type Step = typeof step extends fc.Arbitrary<infer T> ? T : never;

    const apply = (home: Home, s: Step): Home => {
      const rooms = home.rooms;
      switch (s.kind) {
        case 'edit': {
          const r = rooms[s.at % rooms.length];
          if (!r) return home;
          return withRoom(
            home,
            edit(r, {
              occupants: s.occupants,
              exposedWalls: r.exposedWalls.map((w, i) =>
                i === 0
                  ? {
                      ...w,
                      lengthFt: s.wallFt,
                      color: s.color,
                      windows: [{ areaFt2: s.glass + 1, glazing: 'double-clear' }],
                    }
                  : w,
              ),
            }),
          );
        }
        case 'add':
          return { ...home, rooms: [...rooms, newRoom(s.room)] };
        case 'remove': {
          if (rooms.length <= 1) return home;
          const gone = rooms[s.at % rooms.length]?.id;
          const kept = home.ducts?.roomIds?.filter((id) => id !== gone);
          const systems = home.ductSystems
            ?.map((d) => ({ ...d, roomIds: d.roomIds?.filter((id) => id !== gone) }))
            .filter((d) => (d.roomIds?.length ?? 0) > 0);
          return {
            ...home,
            rooms: rooms.filter((r) => r.id !== gone),
            ducts: home.ducts && { ...home.ducts, roomIds: kept && kept.length > 0 ? kept : undefined },
            ductSystems: systems && systems.length > 0 ? systems : undefined,
          };
        }
        case 'tightness':
          return { ...home, tightness: s.tightness, blowerDoorCfm50: s.blowerDoor };
        case 'ducts': {
          if (!s.ducts) return { ...home, ducts: undefined, ductSystems: undefined };
          const { someRooms, ...d } = s.ducts;
          // Some rooms on the ducted system (every other one), or all of them.
          const roomIds = someRooms ? rooms.filter((_, i) => i % 2 === 0).map((r) => r.id) : undefined;
          return { ...home, ducts: ductSystemSchema.parse({ ...d, roomIds }), ductSystems: undefined };
        }
        case 'two-ducts': {
          // Upstairs: the even rooms; downstairs: the odd ones (some rooms, when someRooms, on neither).
          const systems = [s.upstairs, s.downstairs].flatMap((x, parity) => {
            if (!x) return [];
            const { someRooms, ...d } = x;
            const roomIds = rooms.filter((_, i) => i % 2 === parity && (!someRooms || i % 4 < 2)).map((r) => r.id);
            return roomIds.length > 0 ? [ductSystemSchema.parse({ ...d, roomIds })] : [];
          });
          return { ...home, ducts: undefined, ductSystems: systems.length > 0 ? systems : undefined };
        }
        case 'ventilation':
          return {
            ...home,
            bedrooms: s.bedrooms,
            ventilation: s.vent === 'none' ? undefined : ventilationSchema.parse({ kind: s.vent }),
          };
        case 'conditions':
          // A new object every time; the same values when `hotter` is 0 (the live path must not redo the rooms).
          return {
            ...home,
            designConditions: designConditionsSchema.parse({
              ...ducted.designConditions,
              outdoorCoolingDryBulbF: ducted.designConditions.outdoorCoolingDryBulbF + s.hotter,
            }),
          };
      }
    };

    fc.assert(
      fc.property(fc.array(step, { minLength: 1, maxLength: 8 }), (steps) => {
        const live = liveHome();
        let home = ducted;
        expect(live.load(home)).toEqual(homeLoadFromParsed(home));
        for (const s of steps) {
          const before = home;
          home = apply(home, s);
          const full = homeLoadFromParsed(home);
          // The room editor's question first (the live path's cheap one), for every room, then the whole home.
          home.rooms.forEach((r, i) => {
            expect(live.room(home, r.id), `${s.kind}: ${r.id}`).toEqual(full.rooms.find((x) => x.roomId === r.id));
            if (i > 0) return;
            // The ducts, and design conditions that read the same, leave every room's own hours as they were.
            const sameDay = JSON.stringify(before.designConditions) === JSON.stringify(home.designConditions);
            if (s.kind === 'ducts' || s.kind === 'two-ducts' || (s.kind === 'conditions' && sameDay))
              expect(live.lastRecomputed).toBe(0);
          });
          expect(live.load(home)).toEqual(full);
        }
      }),
      { numRuns: 60 },
    );
    // A generous limit: the machine that runs the suite may be busy (this is not a speed check).
  }, 60_000);
});

describe('the first pass in pieces (issue 11: a phone hands the main thread back between them)', () => {
  // The reference is again `homeLoadFromParsed`, the full recompute (see the top of this file), and the
  // one-task live pass: the pieces only move work earlier, so the figures must be the very same numbers.
  const plain: Home = { ...ducted, ducts: undefined };

  it('every piece run, then load: the same figures as one whole pass, with no room worked out twice', () => {
    for (const home of [plain, ducted]) {
      const live = liveHome();
      // The design day, then one piece per room.
      expect([...live.prepareInPieces(home)]).toHaveLength(home.rooms.length + 1);
      const load = live.load(home);
      expect(live.lastRecomputed).toBe(0);
      expect(load).toStrictEqual(liveHome().load(home));
      expect(load).toStrictEqual(homeLoadFromParsed(home));
      // A second run finds every room's hours kept: nothing left to do but the design day.
      expect([...live.prepareInPieces(home)]).toHaveLength(1);
    }
  });

  it('property: a room edited, or the design day changed, between pieces never leaves a stale figure', () => {
    const ids = ducted.rooms.map((r) => r.id);
    fc.assert(
      fc.property(
        fc.nat({ max: ducted.rooms.length + 1 }),
        fc.constantFrom(...ids),
        fc.integer({ min: 8, max: 30 }),
        fc.integer({ min: 0, max: 6 }),
        (stopAfter, id, wallFt, hotter) => {
          const live = liveHome();
          const pieces = live.prepareInPieces(ducted);
          for (let i = 0; i < stopAfter; i += 1) pieces.next();
          // Meanwhile the page asks about an edited room, in a home whose day may read differently.
          const r = roomOf(ducted, id);
          let home = withRoom(
            ducted,
            edit(r, { exposedWalls: r.exposedWalls.map((w, i) => (i === 0 ? { ...w, lengthFt: wallFt } : w)) }),
          );
          if (hotter > 0)
            home = {
              ...home,
              designConditions: designConditionsSchema.parse({
                ...ducted.designConditions,
                outdoorCoolingDryBulbF: ducted.designConditions.outdoorCoolingDryBulbF + hotter,
              }),
            };
          const full = homeLoadFromParsed(home);
          expect(live.room(home, id)).toStrictEqual(full.rooms.find((x) => x.roomId === id));
          // The rest of the pieces (for the home as it was), then the home as it is now.
          for (let step = pieces.next(); !step.done; step = pieces.next());
          expect(live.load(home)).toStrictEqual(full);
        },
      ),
      { numRuns: 30 },
    );
    // A generous limit: the machine that runs the suite may be busy (this is not a speed check).
  }, 60_000);
});
