import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { homeInputSchema, homeLoadFromParsed, liveHome, roomInputSchema, type Home, type Room } from '@calc';
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

    // A longer outside wall: the exposed envelope changes, so every room's share of the leakage does.
    const home3 = withRoom(
      home2,
      edit(wider, { exposedWalls: wider.exposedWalls.map((w) => ({ ...w, lengthFt: 22 })) }),
    );
    expect(live.load(home3)).toEqual(homeLoadFromParsed(home3));
    expect(live.lastRecomputed).toBe(ducted.rooms.length);
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
  });
});
