import {
  CalcError,
  COMPONENT_KEYS,
  designConditionsSchema,
  homeLoad,
  houseSchema,
  roomInputSchema,
  roomLoad,
  type ComponentKey,
  type DesignConditions,
  type Home,
  type HomeLoad,
  type Room,
  type RoomLoad,
  type Tightness,
} from '@calc';

/** Our words for calc's load components (chart labels and the printout). */
export const COMPONENT_LABELS: Record<ComponentKey, string> = {
  walls: 'Walls',
  windowsConduction: 'Windows (conduction)',
  windowsSolar: 'Sun through glass',
  doors: 'Doors',
  ceiling: 'Ceiling',
  floor: 'Floor',
  infiltration: 'Air leakage',
  ventilation: 'Ventilation',
  people: 'People',
  appliances: 'Appliances',
  ducts: 'Ducts',
};
export { COMPONENT_KEYS };

export { tons } from './tons';

export type LoadResult<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly message: string };

function fail(e: unknown): { ok: false; message: string } {
  if (e instanceof CalcError) return { ok: false, message: e.details[0]?.message ?? e.message };
  return { ok: false, message: 'The loads could not be worked out from these inputs.' };
}

/** One room, live, with calc's roomLoad — the same engine the server runs. */
export function computeRoomLoad(
  room: Room,
  designConditions: Record<string, unknown> | null,
  tightness: Tightness,
): LoadResult<RoomLoad> {
  if (!designConditions)
    return { ok: false, message: 'Enter the design conditions for the site to see this room’s loads.' };
  try {
    return {
      ok: true,
      value: roomLoad({
        room,
        designConditions: designConditionsSchema.parse(designConditions),
        tightness,
      }),
    };
  } catch (e) {
    return fail(e);
  }
}

/** The job's whole-house facts as calc reads them; a stored value calc refuses is left out (the form shows why). */
export function houseOf(house: Record<string, unknown>) {
  const parsed = houseSchema.safeParse(house);
  return parsed.success ? parsed.data : {};
}

/** A stored room as calc reads it, or null when calc refuses it. */
export type ParseRoom = (id: string, input: Record<string, unknown>) => Room | null;

/** The ways a whole-home path reads its inputs and works out the loads; only these differ between paths. */
export interface WholeHomePath {
  readonly parseRoom: ParseRoom;
  readonly parseConditions: (designConditions: Record<string, unknown>) => DesignConditions | null;
  /** The loads of a home whose rooms and conditions calc accepts (may refuse it with its own words). */
  readonly load: (home: Home) => LoadResult<HomeLoad>;
}

/** A whole-home path as the pages call it: the rooms as stored, the job's conditions, tightness and house facts. */
export type WholeHomeLoad = (
  inputs: readonly { readonly id: string; readonly input: Record<string, unknown> }[],
  designConditions: Record<string, unknown> | null,
  tightness: Tightness,
  house?: Record<string, unknown>,
) => LoadResult<{ load: HomeLoad; skipped: readonly string[] }>;

/**
 * The whole home from the rooms calc accepts; rooms it refuses are named in `skipped`
 * so the totals never silently leave one out. The one frame of both whole-home paths: the full
 * recompute below and the walk-through's live engine (`computeLiveHomeLoad`).
 */
export function wholeHomeLoad(path: WholeHomePath): WholeHomeLoad {
  return (inputs, designConditions, tightness, house = {}) => {
    if (!designConditions) return { ok: false, message: 'Enter the design conditions for the site to see the loads.' };
    const rooms: Room[] = [];
    const skipped: string[] = [];
    for (const r of inputs) {
      const parsed = path.parseRoom(r.id, r.input);
      if (parsed) rooms.push(parsed);
      else skipped.push(typeof r.input.name === 'string' ? r.input.name : r.id);
    }
    if (rooms.length === 0) return { ok: false, message: 'Add a room to see the loads.' };
    const conditions = path.parseConditions(designConditions);
    if (!conditions)
      return {
        ok: false,
        message:
          designConditionsSchema.safeParse(designConditions).error?.issues[0]?.message ??
          'Check the design conditions.',
      };
    try {
      const load = path.load({ ...houseOf(house), designConditions: conditions, tightness, rooms });
      return load.ok ? { ok: true, value: { load: load.value, skipped } } : load;
    } catch (e) {
      return fail(e);
    }
  };
}

const fullRecompute: WholeHomePath = {
  parseRoom: (id, input) => {
    const parsed = roomInputSchema.safeParse({ ...input, id });
    return parsed.success ? parsed.data : null;
  },
  parseConditions: (c) => {
    const parsed = designConditionsSchema.safeParse(c);
    return parsed.success ? parsed.data : null;
  },
  load: (home) => ({ ok: true, value: homeLoad({ home }) }),
};

/** The whole home with calc's `homeLoad`, every room parsed afresh (the loads page and its printout). */
export const computeHomeLoad = wholeHomeLoad(fullRecompute);
