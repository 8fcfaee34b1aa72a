import { describe, expect, it } from 'vitest';
import { keepNewerRooms } from '../../client/src/entities/job/queries';

describe('rooms refetch', () => {
  it('never takes a room back to an older version than the one this tab already holds', () => {
    const held = [
      { id: 'a', version: 2, input: { name: 'Renamed' } },
      { id: 'b', version: 1, input: { name: 'Den' } },
    ];
    const late = [
      { id: 'a', version: 1, input: { name: 'Old name' } },
      { id: 'b', version: 3, input: { name: 'Den (theirs)' } },
      { id: 'c', version: 1, input: { name: 'New' } },
    ];
    expect(keepNewerRooms(held, late)).toEqual([held[0], late[1], late[2]]);
  });
  it('drops rooms the server no longer has, and passes anything else through', () => {
    expect(keepNewerRooms([{ id: 'a', version: 2 }], [])).toEqual([]);
    expect(keepNewerRooms(undefined, [{ id: 'a', version: 1 }])).toEqual([{ id: 'a', version: 1 }]);
  });
});
