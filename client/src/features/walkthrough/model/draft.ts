/**
 * Reading and writing the loosely typed room draft. The draft is what the person typed
 * (calc's room input shape, unchecked); calc's schema checks it before it is saved or used.
 */
export type Draft = Record<string, unknown>;

export function isRecord(v: unknown): v is Draft {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

export const asNumber = (v: unknown): number | undefined => (typeof v === 'number' ? v : undefined);
export const asString = (v: unknown, fallback = ''): string => (typeof v === 'string' ? v : fallback);
export const asRecords = (v: unknown): Draft[] => (Array.isArray(v) ? v.filter(isRecord) : []);
export const asRecord = (v: unknown): Draft => (isRecord(v) ? v : {});

export type PathPart = string | number;

/** A copy of `obj` with the value at `path` replaced (undefined removes an object key). */
export function setIn(obj: unknown, path: readonly PathPart[], value: unknown): unknown {
  const [head, ...rest] = path;
  if (head === undefined) return value;
  if (typeof head === 'number') {
    const list = Array.isArray(obj) ? [...obj] : [];
    list[head] = setIn(list[head], rest, value);
    return list;
  }
  const rec: Draft = { ...asRecord(obj) };
  const next = setIn(rec[head], rest, value);
  if (next === undefined) delete rec[head];
  else rec[head] = next;
  return rec;
}

export function getIn(obj: unknown, path: readonly PathPart[]): unknown {
  let cur: unknown = obj;
  for (const p of path) {
    if (typeof p === 'number') cur = Array.isArray(cur) ? cur[p] : undefined;
    else cur = isRecord(cur) ? cur[p] : undefined;
  }
  return cur;
}

/** Removes item `index` of the list at `path`. */
export function removeAt(obj: unknown, path: readonly PathPart[], index: number): unknown {
  const list = getIn(obj, path);
  return setIn(obj, path, Array.isArray(list) ? list.filter((_, i) => i !== index) : []);
}

/** Appends `item` to the list at `path`. */
export function append(obj: unknown, path: readonly PathPart[], item: unknown): unknown {
  const list = getIn(obj, path);
  return setIn(obj, path, [...(Array.isArray(list) ? list : []), item]);
}
