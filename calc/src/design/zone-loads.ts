import { CalcError } from '../errors';
import { floorAreaFt2 } from '../geometry';
import { coincidentLoad, type HomeLoad } from '../loads/home-load';
import type { Zone } from '../schemas/design';
import type { Room } from '../schemas/room-input';
import type { LoadToMeet } from '../sizing/match';

/** A zone's summed loads (Btu/h) and the floor areas an A2L leak could spread over, ft². */
export interface ZoneLoad extends LoadToMeet {
  /** The room holding the indoor unit (the zone's headRoomId, else its first room). */
  readonly headRoomAreaFt2: number;
  readonly headRoomName: string;
  /** All the zone's rooms together (the rooms a ducted unit serves, or one open space). */
  readonly servedAreaFt2: number;
  readonly servedRoomNames: readonly string[];
}

/** Each zone's coincident load (its rooms' summed hourly sensible at their joint peak hour; latent and heating add up). Throws UNKNOWN_ROOM (with the field path) for a room id not in the home, or a head room not among the zone's rooms. */
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
    if (z.headRoomId !== undefined && !z.roomIds.includes(z.headRoomId))
      throw new CalcError('UNKNOWN_ROOM', [
        { path: ['zones', zi, 'headRoomId'], message: `The indoor unit's room must be one of the zone's rooms` },
      ]);
    const headId = z.headRoomId ?? z.roomIds[0];
    const headRoom = headId === undefined ? undefined : roomsById.get(headId);
    let servedAreaFt2 = 0;
    const servedRoomNames: string[] = [];
    for (const id of z.roomIds) {
      const r = roomsById.get(id);
      if (!r) continue;
      servedAreaFt2 += floorAreaFt2(r);
      servedRoomNames.push(r.name);
    }
    out.set(z.key, {
      sensibleBtuh,
      latentBtuh,
      heatingBtuh,
      headRoomAreaFt2: headRoom ? floorAreaFt2(headRoom) : 0,
      headRoomName: headRoom?.name ?? '',
      servedAreaFt2,
      servedRoomNames,
    });
  }
  return out;
}
