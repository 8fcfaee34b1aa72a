import { CalcError } from '../errors';
import { floorAreaFt2 } from '../geometry';
import { coincidentLoad, type HomeLoad } from '../loads/home-load';
import type { Zone } from '../schemas/design';
import type { Room } from '../schemas/room-input';
import type { LoadToMeet } from '../sizing/match';

/** A zone's summed loads (Btu/h) and the floor area of the room holding the indoor unit (the zone's first room), ft². */
export interface ZoneLoad extends LoadToMeet {
  readonly headRoomAreaFt2: number;
}

/** Each zone's coincident load (its rooms' summed hourly sensible at their joint peak hour; latent and heating add up). Throws UNKNOWN_ROOM (with the field path) for a room id not in the home. */
export function zoneLoads({
  loads,
  zones,
  roomsById,
}: {
  readonly loads: HomeLoad;
  readonly zones: readonly Zone[];
  readonly roomsById: ReadonlyMap<string, Room>;
}): Map<string, ZoneLoad> {
  const known = new Set<string>();
  for (const r of loads.rooms) known.add(r.roomId);
  const out = new Map<string, ZoneLoad>();
  for (let zi = 0; zi < zones.length; zi += 1) {
    const z = zones[zi];
    if (z === undefined) continue;
    for (let ri = 0; ri < z.roomIds.length; ri += 1) {
      const id = z.roomIds[ri] ?? '';
      if (!known.has(id))
        throw new CalcError('UNKNOWN_ROOM', [
          { path: ['zones', zi, 'roomIds', ri], message: `Room "${id}" is not in the home` },
        ]);
    }
    const c = coincidentLoad({ loads, roomIds: z.roomIds });
    const sensibleBtuh = c.sensibleBtuh;
    const latentBtuh = c.latentBtuh;
    const heatingBtuh = c.heatingBtuh;
    const first = z.roomIds[0];
    const headRoom = first === undefined ? undefined : roomsById.get(first);
    out.set(z.key, { sensibleBtuh, latentBtuh, heatingBtuh, headRoomAreaFt2: headRoom ? floorAreaFt2(headRoom) : 0 });
  }
  return out;
}
