import {
  CalcError,
  COMPONENT_KEYS,
  designConditionsSchema,
  homeLoad,
  houseSchema,
  roomInputSchema,
  roomLoad,
  type ComponentKey,
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

/**
 * The whole home from the rooms calc accepts; rooms it refuses are named in `skipped`
 * so the totals never silently leave one out.
 */
export function computeHomeLoad(
  inputs: readonly { readonly id: string; readonly input: Record<string, unknown> }[],
  designConditions: Record<string, unknown> | null,
  tightness: Tightness,
  house: Record<string, unknown> = {},
): LoadResult<{ load: HomeLoad; skipped: readonly string[] }> {
  if (!designConditions) return { ok: false, message: 'Enter the design conditions for the site to see the loads.' };
  const rooms: Room[] = [];
  const skipped: string[] = [];
  for (const r of inputs) {
    const parsed = roomInputSchema.safeParse({ ...r.input, id: r.id });
    if (parsed.success) rooms.push(parsed.data);
    else skipped.push(typeof r.input.name === 'string' ? r.input.name : r.id);
  }
  if (rooms.length === 0) return { ok: false, message: 'Add a room to see the loads.' };
  const parsedConditions = designConditionsSchema.safeParse(designConditions);
  if (!parsedConditions.success)
    return { ok: false, message: parsedConditions.error.issues[0]?.message ?? 'Check the design conditions.' };
  try {
    return {
      ok: true,
      value: {
        load: homeLoad({
          home: {
            designConditions: parsedConditions.data,
            tightness,
            ...houseOf(house),
            rooms,
          },
        }),
        skipped,
      },
    };
  } catch (e) {
    return fail(e);
  }
}
