import { CalcError } from '../errors';
import { floorAreaFt2 } from '../geometry';
import type { HomeLoad } from '../loads/home-load';
import type { RoomLoad } from '../loads/room-load';
import type { Zone } from '../schemas/design';
import type { Room } from '../schemas/room-input';
import type { LoadToMeet } from '../sizing/match';

/** A zone's summed loads (Btu/h) and the floor area of the room holding the indoor unit (the zone's first room), ft². */
export interface ZoneLoad extends LoadToMeet {
  readonly headRoomAreaFt2: number;
}

/** Sums room loads per zone. Throws UNKNOWN_ROOM (with the field path) for a room id not in the home. */
export function zoneLoads({
  loads,
  zones,
  roomsById,
}: {
  readonly loads: HomeLoad;
  readonly zones: readonly Zone[];
  readonly roomsById: ReadonlyMap<string, Room>;
}): Map<string, ZoneLoad> {
  const byRoom = new Map<string, RoomLoad>();
  for (const r of loads.rooms) byRoom.set(r.roomId, r);
  const out = new Map<string, ZoneLoad>();
  for (let zi = 0; zi < zones.length; zi += 1) {
    const z = zones[zi];
    if (z === undefined) continue;
    let sensibleBtuh = 0;
    let latentBtuh = 0;
    let heatingBtuh = 0;
    for (let ri = 0; ri < z.roomIds.length; ri += 1) {
      const id = z.roomIds[ri] ?? '';
      const r = byRoom.get(id);
      if (!r)
        throw new CalcError('UNKNOWN_ROOM', [
          { path: ['zones', zi, 'roomIds', ri], message: `Room "${id}" is not in the home` },
        ]);
      sensibleBtuh += r.sensibleGain.total;
      latentBtuh += r.latentGain.total;
      heatingBtuh += r.heatLoss.total;
    }
    const first = z.roomIds[0];
    const headRoom = first === undefined ? undefined : roomsById.get(first);
    out.set(z.key, { sensibleBtuh, latentBtuh, heatingBtuh, headRoomAreaFt2: headRoom ? floorAreaFt2(headRoom) : 0 });
  }
  return out;
}
