import {
  designConditionsSchema,
  homeRoomIssues,
  liveHome,
  MOST_ROOMS_IN_HOME,
  roomInputSchema,
  type DesignConditions,
  type Home,
  type Room,
  type RoomLoad,
  type Tightness,
} from '@calc';
import { inSlices, yieldToMain } from '../../../lib/yield-to-main';
import { houseOf, wholeHomeLoad, type LoadResult, type WholeHomeLoad, type WholeHomePath } from './compute';

/** The rest of the home the edited room sits in: the rooms as they stand (saved or waiting) and the house facts. */
export interface LiveHomeInputs {
  readonly rooms: readonly { readonly id: string; readonly input: Record<string, unknown> }[];
  readonly house?: Record<string, unknown> | undefined;
}

/**
 * One engine for the page: each call reworks only the rooms whose hours changed (calc's liveHome), so
 * the room panel and the pinned bar can both ask on every keystroke.
 */
const live = liveHome();
/** Each stored room input parsed once (the rooms' records keep their objects until they change). */
const parsedRooms = new WeakMap<object, Room | null>();
const parsedConditions = new WeakMap<object, DesignConditions | null>();

function parseRoom(id: string, input: Record<string, unknown>): Room | null {
  const held = parsedRooms.get(input);
  if (held !== undefined && (held === null || held.id === id)) return held;
  const parsed = roomInputSchema.safeParse({ ...input, id });
  const room = parsed.success ? parsed.data : null;
  parsedRooms.set(input, room);
  return room;
}

function parseConditions(c: Record<string, unknown>): DesignConditions | null {
  const held = parsedConditions.get(c);
  if (held !== undefined) return held;
  const parsed = designConditionsSchema.safeParse(c);
  const out = parsed.success ? parsed.data : null;
  parsedConditions.set(c, out);
  return out;
}

/**
 * The edited room's loads as the whole home will have them once it is saved: its share of the house's
 * leakage, ventilation and default gains, and of the ducted system's gains and losses when the home has
 * ducts — the same figures the server's full recompute gives (`homeLoadFromParsed`), with the draft in
 * place of the room's saved input. Rooms calc refuses are left out, as the whole-home totals leave them.
 */
export function computeLiveRoomLoad(
  room: Room,
  home: LiveHomeInputs,
  designConditions: Record<string, unknown> | null,
  tightness: Tightness,
): LoadResult<RoomLoad> & { readonly ducts?: boolean } {
  if (!designConditions)
    return { ok: false, message: 'Enter the design conditions for the site to see this room’s loads.' };
  const conditions = parseConditions(designConditions);
  if (!conditions) return { ok: false, message: 'Check the design conditions to see this room’s loads.' };
  const rooms: Room[] = [];
  let placed = false;
  for (const r of home.rooms) {
    if (r.id === room.id) {
      rooms.push(room);
      placed = true;
      continue;
    }
    const parsed = parseRoom(r.id, r.input);
    if (parsed) rooms.push(parsed);
  }
  if (!placed) rooms.push(room);
  const house = houseOf(home.house ?? {});
  const ducts = house.ducts !== undefined && house.ducts.roomIds?.includes(room.id) !== false;
  const whole: Home = { ...house, designConditions: conditions, tightness, rooms };
  try {
    const load = live.room(whole, room.id);
    if (!load) return { ok: false, message: 'The loads could not be worked out from these inputs.' };
    return { ok: true, value: load, ducts };
  } catch {
    return { ok: false, message: 'The loads could not be worked out from these inputs.' };
  }
}

/** The live engine's side of the whole-home frame: rooms and conditions parsed once, calc's checks first. */
const livePath: WholeHomePath = {
  parseRoom,
  parseConditions,
  load: (home) => {
    if (home.rooms.length > MOST_ROOMS_IN_HOME) return { ok: false, message: `At most ${MOST_ROOMS_IN_HOME} rooms` };
    const issue = homeRoomIssues(home)[0];
    if (issue) return { ok: false, message: issue.message };
    return { ok: true, value: live.load(home) };
  },
};

/** The whole home's loads, live, worked out afresh (see computeLiveHomeLoad, which keeps the last answer). */
const liveHomeLoad = wholeHomeLoad(livePath);

type RoomInputs = Parameters<WholeHomeLoad>[0];

/** The same rooms (each id with the same stored input object): parsed and worked out, they give the same figures. */
const sameInputs = (a: RoomInputs, b: RoomInputs) =>
  a === b || (a.length === b.length && a.every((r, i) => r.id === b[i]?.id && r.input === b[i]?.input));
const sameHouse = (a: Record<string, unknown>, b: Record<string, unknown>) =>
  a === b || (Object.keys(a).length === 0 && Object.keys(b).length === 0);

/** The last whole-home answer and what it was asked with (the page's records never change in place). */
let lastWhole: {
  readonly inputs: RoomInputs;
  readonly designConditions: Record<string, unknown> | null;
  readonly tightness: Tightness;
  readonly house: Record<string, unknown>;
  readonly result: ReturnType<WholeHomeLoad>;
} | null = null;

/**
 * The whole home's loads, live: exactly `computeHomeLoad` (calc's `homeLoad` of the rooms calc accepts,
 * with the others named in `skipped`), but through the page's one engine — each room parsed once and its
 * hourly work kept — so the totals under the walk-through cost a recombination when the page renders
 * again instead of a full parse and recompute of every room (issue 11: on a phone that was 50–100 ms of
 * main-thread work on every save status change). Asked again with the same rooms (the same input
 * objects), conditions, tightness and house, it gives the last answer: the first render after
 * `primeLive` then takes the figures primeLive worked out.
 */
export const computeLiveHomeLoad: WholeHomeLoad = (inputs, designConditions, tightness, house = {}) => {
  const last = lastWhole;
  if (
    last &&
    last.designConditions === designConditions &&
    last.tightness === tightness &&
    sameHouse(last.house, house) &&
    sameInputs(last.inputs, inputs)
  )
    return last.result;
  const result = liveHomeLoad(inputs, designConditions, tightness, house);
  lastWhole = { inputs, designConditions, tightness, house, result };
  return result;
};

/** What the page's live figures will be asked for: the home as it stands. */
export interface LivePrime extends LiveHomeInputs {
  readonly designConditions: Record<string, unknown> | null;
  readonly tightness: Tightness;
}

/**
 * Gets the engine ready for a home before its first figures render, in slices a keystroke can come
 * between (`inSlices`, about 8 ms each): each room parsed, then calc's costly part in pieces
 * (`liveHome().prepareInPieces`: the design day, then each room's hours), then the recombination in a
 * task of its own, whose answer the first render takes (computeLiveHomeLoad keeps it). On the 100-room
 * bench job at 4× CPU the whole pass was one task of about 120 ms, and a letter typed meanwhile waited for
 * all of it. Nothing is shown from here: the live parts say "Working out the loads…" until it is done.
 */
export async function primeLive(home: LivePrime, stillWanted: () => boolean = () => true): Promise<void> {
  const rooms: Room[] = [];
  const parsed = await inSlices(
    home.rooms,
    (r) => {
      const room = parseRoom(r.id, r.input);
      if (room) rooms.push(room);
    },
    { stillWanted },
  );
  if (!parsed) return;
  const conditions = home.designConditions ? parseConditions(home.designConditions) : null;
  if (conditions && rooms.length > 0 && rooms.length <= MOST_ROOMS_IN_HOME) {
    // The home exactly as computeLiveHomeLoad will give it to calc (the same parsed objects).
    const whole: Home = {
      ...houseOf(home.house ?? {}),
      designConditions: conditions,
      tightness: home.tightness,
      rooms,
    };
    const worked = await inSlices(live.prepareInPieces(whole), () => undefined, { stillWanted });
    if (!worked) return;
  }
  await yieldToMain();
  if (!stillWanted()) return;
  computeLiveHomeLoad(home.rooms, home.designConditions, home.tightness, home.house ?? {});
}
