import type { DesignConditions } from '../schemas/design-conditions';
import type { Home } from '../schemas/home';
import type { Room } from '../schemas/room-input';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { designDayContext, type DesignDayContext } from './design-day-context';
import { blockOfWork, homeLoadFromWork, houseAir, type HomeLoad, type HouseAir } from './home-load';
import { roomHourly, roomLoadFromHourly, type RoomAir, type RoomHourly, type RoomLoad } from './room-load';

/**
 * The per-keystroke path, exact: the whole home's loads with every whole-house term (leakage shared by
 * envelope, ventilation, default internal gains, and the ducted system's share), equal to
 * `homeLoadFromParsed` of the same home — only cheaper. A room's hourly work (the costly part) is
 * kept between calls and redone only when the room itself (a new object) or its share of the house
 * air changed; the ducts, the block hour and the figures are recombined every call from copies.
 * Give it the same Room objects for rooms that did not change (the walk-through parses each saved
 * room once); the design day is kept while the design conditions read the same.
 */
export interface LiveHome {
  /** The home's loads, exactly as `homeLoadFromParsed(home)` gives them. */
  load(home: Home): HomeLoad;
  /**
   * One room's figures in the home, exactly `homeLoadFromParsed(home).rooms` of that room (null when it
   * is not in the home), without working out the other rooms' results: what a room editor shows.
   */
  room(home: Home, roomId: string): RoomLoad | null;
  /** How many rooms' hours the last call worked out again (the rest were kept). */
  readonly lastRecomputed: number;
}

interface Held {
  readonly room: Room;
  readonly air: RoomAir;
  readonly work: RoomHourly;
}

function sameAir(a: RoomAir, b: RoomAir): boolean {
  if (
    a.summerCfm !== b.summerCfm ||
    a.winterCfm !== b.winterCfm ||
    a.ventCfm !== b.ventCfm ||
    a.ventCoolingSensibleCfm !== b.ventCoolingSensibleCfm ||
    a.ventLatentCfm !== b.ventLatentCfm ||
    a.ventHeatingCfm !== b.ventHeatingCfm
  )
    return false;
  const x = a.defaultInternal;
  const y = b.defaultInternal;
  if (!x || !y) return x === y;
  return (
    x.peopleSensible === y.peopleSensible &&
    x.peopleLatent === y.peopleLatent &&
    x.otherSensible === y.otherSensible &&
    x.otherLatent === y.otherLatent
  );
}

/** A fresh copy of a room's hourly work: the ducts write into the tables they are given. */
const copyOf = (w: RoomHourly): RoomHourly => ({ ...w, table: w.table.slice(), hourly: w.hourly.slice() });

export function liveHome(): LiveHome {
  let conditionsKey = '';
  let psy: DesignPsychrometrics | null = null;
  let ctx: DesignDayContext | null = null;
  let held = new Map<string, Held>();
  let lastRecomputed = 0;
  const dayFor = (c: DesignConditions): [DesignPsychrometrics, DesignDayContext] => {
    const key = JSON.stringify(c);
    if (key !== conditionsKey || !psy || !ctx) {
      conditionsKey = key;
      psy = designPsychrometrics(c);
      ctx = designDayContext(c);
      held = new Map();
    }
    return [psy, ctx];
  };
  /** Each room's hourly work before ducts: kept when the room and its air are the same, else redone. */
  const prepare = (home: Home): { p: DesignPsychrometrics; c: DesignDayContext; air: HouseAir; work: RoomHourly[] } => {
    const [p, c] = dayFor(home.designConditions);
    const air = houseAir(home);
    const next = new Map<string, Held>();
    const work: RoomHourly[] = [];
    lastRecomputed = 0;
    home.rooms.forEach((room, i) => {
      const a = air.airs[i];
      if (!a) return;
      const kept = held.get(room.id);
      let w: RoomHourly;
      if (kept && kept.room === room && sameAir(kept.air, a)) w = kept.work;
      else {
        w = roomHourly(room, p, c, a);
        lastRecomputed += 1;
      }
      next.set(room.id, { room, air: a, work: w });
      work.push(home.ducts ? copyOf(w) : w);
    });
    held = next;
    return { p, c, air, work };
  };
  return {
    get lastRecomputed() {
      return lastRecomputed;
    },
    load(home) {
      const { p, c, air, work } = prepare(home);
      return homeLoadFromWork(home, p, c, air, work);
    },
    room(home, roomId) {
      const i = home.rooms.findIndex((r) => r.id === roomId);
      if (i < 0) return null;
      const { p, c, air, work } = prepare(home);
      const { work: done, block } = blockOfWork(home, p, c, air.areas, work);
      const w = done[i];
      return w ? roomLoadFromHourly(w, p, block) : null;
    },
  };
}
