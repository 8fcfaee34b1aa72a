import { describe, expect, it } from 'vitest';
import { computeHomeLoad } from '../../client/src/features/loads/model/compute';
import { computeLiveHomeLoad } from '../../client/src/features/loads/model/live-room';
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
});
