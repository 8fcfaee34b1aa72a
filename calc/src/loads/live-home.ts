import type { DesignConditions } from '../schemas/design-conditions';
import type { Home } from '../schemas/home';
import type { Room } from '../schemas/room-input';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { designDayContext, HOURS, type DesignDayContext } from './design-day-context';
import { DEFAULT_RTS_CONSTRUCTION, type RtsConstruction } from './hourly-method';
import { ductHours, ductSystemsOf, roomWithDucts, type HomeDuctHours } from './home-ducts';
import { homeLoadFromWork, houseAir, type HomeLoad, type HouseAir } from './home-load';
import { roomHeating, roomHourly, roomLoadFromHourly, type RoomAir, type RoomHourly, type RoomLoad } from './room-load';

/**
 * The per-keystroke path, exact: the whole home's loads with every whole-house term (leakage shared by
 * envelope, ventilation, default internal gains, and the ducted system's share), equal to
 * `homeLoadFromParsed` of the same home — only cheaper. A room's hourly work (the costly part) is
 * kept between calls and redone only when the room itself (a new object) or its share of the house
 * air changed (its heat loss before ducts is kept with it); the ducts, the block hour and the figures
 * are recombined every call. `room` does not share the ducts out among every room: the block hour
 * needs only the house's hours plus the duct gain of each hour (the served rooms' shares add up to
 * it), and the asked room's shares are worked out alone (`roomWithDucts`, `apportionShare`) — the
 * same integers the full recompute's largest-remainder sharing gives it.
 * Give it the same Room objects for rooms that did not change (the walk-through parses each saved
 * room once); the design day is kept while the design conditions are the same object or read the same.
 */
export interface LiveHome {
  /** The home's loads, exactly as `homeLoadFromParsed(home)` gives them. */
  load(home: Home): HomeLoad;
  /**
   * One room's figures in the home, exactly `homeLoadFromParsed(home).rooms` of that room (null when it
   * is not in the home), without working out the other rooms' results: what a room editor shows.
   */
  room(home: Home, roomId: string): RoomLoad | null;
  /**
   * The costly part of a first `load(home)` or `room(home, …)` — the design day, then each room's hours
   * before ducts — one piece per `next()`, so a caller on a page can hand the main thread back between
   * pieces (issue 11: on a slow phone the first whole-home pass was one ~120 ms task a keystroke waited
   * behind). It returns nothing and changes no figure: what it works out is what `load`/`room` would work
   * out themselves (same room, same air, same day), kept for them, so after the last piece they only
   * recombine (`lastRecomputed` 0). A call to `load`/`room` in between is answered in full as usual; a
   * piece that finds the design day changed meanwhile stops (its work would belong to another day).
   */
  prepareInPieces(home: Home): Generator<void, void, void>;
  /** How many rooms' hours the last call worked out again (the rest were kept). */
  readonly lastRecomputed: number;
}

interface Held {
  readonly room: Room;
  readonly air: RoomAir;
  /** The room's hours before ducts (never changed: the ducts' shares go into copies). */
  readonly work: RoomHourly;
  /** The room's heat loss before ducts, worked out when a ducted system first needs it. */
  heat: number | undefined;
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
  let conditionsSeen: DesignConditions | null = null;
  let conditionsKey = '';
  let psy: DesignPsychrometrics | null = null;
  let ctx: DesignDayContext | null = null;
  let held = new Map<string, Held>();
  let lastRecomputed = 0;
  /**
   * The last recombination of the house (the ducts' hours and the block hour), kept while every room's
   * work is the same object (same room, same air, same design day) and the ducts read the same: the
   * room panel and the pinned bar ask about the same keystroke, and other rooms of an unchanged home.
   */
  let combined: { work: readonly RoomHourly[]; ducts: string; ds: HomeDuctHours[]; block: number } | null = null;
  let massSeen: RtsConstruction = DEFAULT_RTS_CONSTRUCTION;
  const dayFor = (c: DesignConditions, mass: RtsConstruction): [DesignPsychrometrics, DesignDayContext] => {
    // The same object read the same last time (the walk-through parses the conditions once); else compare by value.
    if (c !== conditionsSeen || mass !== massSeen || !psy || !ctx) {
      const key = `${mass} ${JSON.stringify(c)}`;
      if (key !== conditionsKey || !psy || !ctx) {
        conditionsKey = key;
        psy = designPsychrometrics(c);
        ctx = designDayContext(c, mass);
        held = new Map();
      }
      conditionsSeen = c;
      massSeen = mass;
    }
    return [psy, ctx];
  };
  /** Each room's hourly work before ducts: kept when the room and its air are the same, else redone. */
  const prepare = (
    home: Home,
  ): { p: DesignPsychrometrics; c: DesignDayContext; air: HouseAir; work: RoomHourly[]; kept: Held[] } => {
    const [p, c] = dayFor(home.designConditions, home.thermalMass ?? DEFAULT_RTS_CONSTRUCTION);
    const air = houseAir(home);
    const next = new Map<string, Held>();
    const work: RoomHourly[] = [];
    const kept: Held[] = [];
    lastRecomputed = 0;
    home.rooms.forEach((room, i) => {
      const a = air.airs[i];
      if (!a) return;
      let h = held.get(room.id);
      if (!h || h.room !== room || !sameAir(h.air, a)) {
        h = { room, air: a, work: roomHourly(room, p, c, a), heat: undefined };
        lastRecomputed += 1;
      }
      next.set(room.id, h);
      work.push(h.work);
      kept.push(h);
    });
    held = next;
    return { p, c, air, work, kept };
  };
  return {
    get lastRecomputed() {
      return lastRecomputed;
    },
    *prepareInPieces(home) {
      const [p, c] = dayFor(home.designConditions, home.thermalMass ?? DEFAULT_RTS_CONSTRUCTION);
      yield;
      const air = houseAir(home);
      for (let i = 0; i < home.rooms.length; i += 1) {
        // Another call moved to another design day (and dropped the kept hours): this work is no longer wanted.
        if (ctx !== c || psy !== p) return;
        const room = home.rooms[i];
        const a = air.airs[i];
        if (!room || !a) continue;
        const h = held.get(room.id);
        if (h && h.room === room && sameAir(h.air, a)) continue;
        held.set(room.id, { room, air: a, work: roomHourly(room, p, c, a), heat: undefined });
        yield;
      }
    },
    load(home) {
      const { p, c, air, work } = prepare(home);
      return homeLoadFromWork(home, p, c, air, ductSystemsOf(home).length > 0 ? work.map(copyOf) : work);
    },
    room(home, roomId) {
      const i = home.rooms.findIndex((r) => r.id === roomId);
      if (i < 0) return null;
      const { p, c, air, work, kept } = prepare(home);
      const systems = ductSystemsOf(home);
      const ductsKey = systems.length > 0 ? JSON.stringify(systems) : '';
      let k = combined;
      if (!k || k.ducts !== ductsKey || k.work.length !== work.length || k.work.some((x, j) => x !== work[j])) {
        // The house's hours: every room's before ducts, plus the ducts' gain each hour (the served rooms'
        // shares of it add up to it, so no room's share is needed for the block hour).
        const house = new Float64Array(HOURS);
        for (const x of work) for (let h = 0; h < HOURS; h += 1) house[h] = (house[h] ?? 0) + (x.hourly[h] ?? 0);
        // Each system from its own rooms' work before ducts: no room is on two systems' ducts (the schema), so
        // this is what homeLoad's systems-in-turn read.
        const ds: HomeDuctHours[] = [];
        if (systems.length > 0) {
          const heatOf = (j: number): number => {
            const x = kept[j];
            if (!x) return 0;
            x.heat ??= roomHeating(x.room, p, x.air, 0).total;
            return x.heat;
          };
          for (const ducts of systems) {
            const d = ductHours(ducts, work, p, c, air.areas, heatOf);
            ds.push(d);
            if (d.served.length > 0)
              for (let h = 0; h < HOURS; h += 1) house[h] = (house[h] ?? 0) + (d.byHour[h]?.cooling.sensibleBtuh ?? 0);
          }
        }
        let block = 0;
        for (let h = 1; h < HOURS; h += 1) if ((house[h] ?? 0) > (house[block] ?? 0)) block = h;
        k = combined = { work, ducts: ductsKey, ds, block };
      }
      const d = k.ds.find((x) => x.served.includes(i));
      const w = d ? roomWithDucts(d, work, i) : work[i];
      const block = k.block;
      return w ? roomLoadFromHourly(w, p, block) : null;
    },
  };
}
