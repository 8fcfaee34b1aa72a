import { describe, expect, it } from 'vitest';
import { computeHomeLoad } from '../../client/src/features/loads/model/compute';
import { computeLiveHomeLoad, primeLive } from '../../client/src/features/loads/model/live-room';
import { ranchHome, ranchRooms } from '../calc/ranch-home';

/**
 * The walk-through's whole-home totals go through the page's one live engine (each room parsed once,
 * its hourly work kept) instead of a full parse and recompute on every render (issue 11). The reference
 * is the full path they replaced, `computeHomeLoad` (calc's homeLoad, whose terms the calc tests check
 * against their sources): the same loads, the same rooms named as left out, the same refusals.
 */
const DUCTS = { location: 'attic', insulationR: 6, leakage: 'typical', roofColor: 'dark' } as const;
const conditions = ranchHome.designConditions as Record<string, unknown>;
const saved = () => ranchRooms.map((r) => ({ id: r.id, input: { ...r } as Record<string, unknown> }));

describe('live whole-home totals', () => {
  it('equal the full recompute, with and without ducts, and again after one room changes', () => {
    const rooms = saved();
    for (const house of [{ bedrooms: 3 }, { bedrooms: 3, ducts: DUCTS }]) {
      expect(computeLiveHomeLoad(rooms, conditions, 'average', house)).toEqual(
        computeHomeLoad(rooms, conditions, 'average', house),
      );
    }
    // A room saved again (a new input object): only it is worked out again, and the totals still match.
    const first = rooms[0];
    if (!first) throw new Error('the ranch has no rooms');
    const edited = [{ id: first.id, input: { ...first.input, lengthFt: 31 } }, ...rooms.slice(1)];
    const house = { bedrooms: 3, ducts: DUCTS };
    const live = computeLiveHomeLoad(edited, conditions, 'leaky', house);
    expect(live).toEqual(computeHomeLoad(edited, conditions, 'leaky', house));
    expect(live.ok && live.value.load).not.toEqual(
      (computeHomeLoad(rooms, conditions, 'leaky', house) as { value: unknown }).value,
    );
  });

  it('name the rooms calc refuses, as the full path does', () => {
    const rooms = [...saved(), { id: 'porch', input: { name: 'Porch', lengthFt: -4 } }];
    const live = computeLiveHomeLoad(rooms, conditions, 'average');
    expect(live.ok && live.value.skipped).toEqual(['Porch']);
    expect(live).toEqual(computeHomeLoad(rooms, conditions, 'average'));
  });

  it('refuse what the full path refuses, with its words', () => {
    const rooms = saved();
    // Ducts listed for a room that is no longer in the home (calc's home schema refuses it).
    const stray = { ducts: { ...DUCTS, roomIds: ['living', 'gone'] } };
    expect(computeLiveHomeLoad(rooms, conditions, 'average', stray)).toEqual(
      computeHomeLoad(rooms, conditions, 'average', stray),
    );
    expect(computeLiveHomeLoad(rooms, conditions, 'average', stray)).toMatchObject({ ok: false });
    for (const bad of [null, { ...conditions, indoorCoolingF: 200 }]) {
      const live = computeLiveHomeLoad(rooms, bad, 'average');
      expect(live).toMatchObject({ ok: false });
      expect(live).toEqual(computeHomeLoad(rooms, bad, 'average'));
    }
    expect(computeLiveHomeLoad([], conditions, 'average')).toEqual(computeHomeLoad([], conditions, 'average'));
    // Past the most rooms a home may have (calc's home schema), with the conditions good and bad.
    const first = rooms[0];
    if (!first) throw new Error('the ranch has no rooms');
    const crowded = Array.from({ length: 201 }, (_, i) => ({ id: `room-${i}`, input: first.input }));
    for (const c of [conditions, { ...conditions, indoorCoolingF: 200 }]) {
      const live = computeLiveHomeLoad(crowded, c, 'average');
      expect(live).toMatchObject({ ok: false });
      expect(live).toEqual(computeHomeLoad(crowded, c, 'average'));
    }
  });

  it('got ready in slices first (primeLive), then asked by the render: the full recompute’s figures, the same answer while nothing changed', async () => {
    for (const house of [{ bedrooms: 3 }, { bedrooms: 3, ducts: DUCTS }]) {
      // New input objects: nothing parsed or worked out before for these rooms.
      const rooms = saved();
      await primeLive({ rooms, house, designConditions: conditions, tightness: 'tight' });
      const first = computeLiveHomeLoad(rooms, conditions, 'tight', house);
      expect(first).toStrictEqual(computeHomeLoad(rooms, conditions, 'tight', house));
      // The render takes the answer primeLive left (the same object), and asks again for free while nothing changed.
      expect(computeLiveHomeLoad([...rooms], conditions, 'tight', house)).toBe(first);
    }
  });

  it('a prime no longer wanted stops, and the figures asked for afterwards are still the full ones', async () => {
    const rooms = saved();
    let asked = 0;
    await primeLive({ rooms, designConditions: conditions, tightness: 'leaky' }, () => (asked += 1) < 2);
    expect(computeLiveHomeLoad(rooms, conditions, 'leaky')).toStrictEqual(computeHomeLoad(rooms, conditions, 'leaky'));
  });
});
