import type { ChangeArea, ProposalChange, ProposalSnapshot } from './proposal';

/**
 * What changed between two proposal versions, as plain sentences (issue 14 "What changed"): pure, so the
 * server answers with it and a page can show it. Lists of records are matched by what names them (a room
 * by its id, an option by its place, a system or zone by its key, a line set by its zone, a takeoff line by
 * its item, a monthly plan by its name): a record in one version only is "added" or "removed" (one
 * sentence); in both, each changed value inside it is one sentence. Lists of words (what is included, the
 * cautions, a zone's rooms) report each item added or removed. The issue time is not a change.
 */

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** How the items of a list of records are matched, by the list's field name. */
const IDENTITY: Record<string, (item: Record<string, Json>) => string> = {
  rooms: (r) => String(r.roomId),
  options: (o) => String(o.position),
  systems: (s) => String(s.key),
  zones: (z) => String(z.key),
  lineSets: (l) => String(l.zoneKey),
  takeoff: (l) => String(l.itemKey),
  monthly: (m) => String(m.name),
};

/** The words for a record of a list, in a sentence. */
const NOUN: Record<string, string> = {
  rooms: 'room',
  options: 'option',
  systems: 'system',
  zones: 'zone',
  lineSets: 'line set',
  takeoff: 'takeoff line',
  monthly: 'monthly plan',
};

/** Field names in words (the rest are split from camelCase). */
const WORDS: Record<string, string> = {
  sellCents: 'price before discount',
  discountCents: 'discount',
  subtotalCents: 'subtotal',
  taxCents: 'tax',
  totalCents: 'total',
  depositCents: 'deposit',
  balanceCents: 'balance',
  monthlyPaymentCents: 'monthly payment',
  aprPercent: 'APR (%)',
  floorAreaFt2: 'floor area (ft²)',
  lengthFt: 'run (ft)',
  installedLengthFt: 'installed length (ft)',
  circuitLengthFt: 'circuit length (ft)',
  extraChargeOz: 'extra charge (oz)',
  totalChargeOz: 'total charge (oz)',
  mcaA: 'MCA (A)',
  mocpA: 'MOCP (A)',
  breakerA: 'breaker (A)',
  disconnectA: 'disconnect (A)',
  wireAwg: 'wire (AWG)',
  supplyVoltage: 'supply (V)',
  seer2: 'SEER2',
  eer2: 'EER2',
  hspf2: 'HSPF2',
  key: 'model number',
  calcVersion: 'calculation version',
  cancellationExtra: 'extra cancellation wording',
  logoKey: 'logo',
  postalCode: 'postal code',
};

const words = (k: string): string =>
  WORDS[k] ??
  k
    .replace(/Btuh$/, ' (Btu/h)')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase();

const money = (cents: number) =>
  `${cents < 0 ? '−' : ''}$${(Math.abs(cents) / 100).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`;

function show(field: string, v: Json | undefined): string {
  if (v === null || v === undefined || v === '') return 'none';
  if (typeof v === 'number') return field.endsWith('Cents') ? money(v) : v.toLocaleString('en-US');
  if (typeof v === 'string') return `“${v.length > 80 ? `${v.slice(0, 77)}…` : v}”`;
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  return JSON.stringify(v);
}

const isRecord = (v: Json | undefined): v is Record<string, Json> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

/** Which area of the proposal a path is in (the estimator reads the list grouped by it). */
function areaOf(path: readonly string[]): ChangeArea {
  const [top] = path;
  if (top === 'company')
    return ['terms', 'warranty', 'cancellationExtra'].includes(path[1] ?? '') ? 'terms' : 'company';
  if (top === 'customer' || top === 'site' || top === 'design' || top === 'cautions') return top;
  if (top === 'calcVersion') return 'design';
  if (top === 'loads') return 'rooms';
  if (top === 'options') {
    if (path.includes('lineSets')) return 'line sets';
    if (path.includes('systems')) return 'equipment';
    if (path.includes('takeoff')) return 'takeoff';
    if (path.includes('price') || path.includes('monthly')) return 'prices';
    return 'options';
  }
  return 'options';
}

interface Place {
  /** Where, for the path: field names and record identities. */
  readonly path: readonly string[];
  /** Where, in words: "option “Good” · system “Living system”". */
  readonly where: readonly string[];
}

const nameOf = (item: Record<string, Json>, id: string): string =>
  typeof item.name === 'string'
    ? item.name
    : typeof item.description === 'string'
      ? item.description
      : typeof item.zoneName === 'string'
        ? item.zoneName
        : id;

function sentence(place: Place, text: string): string {
  const where = place.where.join(' · ');
  return where ? `${where[0]!.toUpperCase()}${where.slice(1)}: ${text}.` : `${text[0]!.toUpperCase()}${text.slice(1)}.`;
}

function walk(a: Json | undefined, b: Json | undefined, field: string, place: Place, out: ProposalChange[]): void {
  const push = (text: string, path = place.path) =>
    out.push({ area: areaOf(path), path: path.join('.'), sentence: sentence(place, text) });
  if (isRecord(a) && isRecord(b)) {
    for (const k of new Set([...Object.keys(a), ...Object.keys(b)])) {
      const inner = { path: [...place.path, k], where: place.where };
      if (!(k in a) || !(k in b) || !isRecord(a[k]) || !isRecord(b[k]))
        if (!Array.isArray(a[k]) && !Array.isArray(b[k])) {
          if (JSON.stringify(a[k]) !== JSON.stringify(b[k]))
            out.push({
              area: areaOf(inner.path),
              path: inner.path.join('.'),
              sentence: sentence(place, `${words(k)} ${show(k, a[k])} → ${show(k, b[k])}`),
            });
          continue;
        }
      const sub = isRecord(a[k]) || isRecord(b[k]) ? { path: inner.path, where: [...place.where, words(k)] } : inner;
      walk(a[k], b[k], k, sub, out);
    }
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    const identity = IDENTITY[field];
    if (identity && [...a, ...b].every(isRecord)) {
      const noun = NOUN[field] ?? words(field);
      const left = new Map((a as Record<string, Json>[]).map((x) => [identity(x), x]));
      const right = new Map((b as Record<string, Json>[]).map((x) => [identity(x), x]));
      for (const [id, x] of left) if (!right.has(id)) push(`${noun} “${nameOf(x, id)}” removed`, [...place.path, id]);
      for (const [id, y] of right) {
        const x = left.get(id);
        if (!x) push(`${noun} “${nameOf(y, id)}” added`, [...place.path, id]);
        else
          walk(x, y, field, { path: [...place.path, id], where: [...place.where, `${noun} “${nameOf(y, id)}”`] }, out);
      }
      return;
    }
    // A list of words (or values): each item added or removed, counted (the same line twice counts twice).
    const count = (xs: Json[]) => {
      const m = new Map<string, number>();
      for (const x of xs) m.set(JSON.stringify(x), (m.get(JSON.stringify(x)) ?? 0) + 1);
      return m;
    };
    const ca = count(a);
    const cb = count(b);
    const label = words(field);
    for (const [x, n] of ca)
      for (let i = cb.get(x) ?? 0; i < n; i++)
        push(`${label}: ${show(field, JSON.parse(x) as Json)} removed`, [...place.path, `-${x}`]);
    for (const [x, n] of cb)
      for (let i = ca.get(x) ?? 0; i < n; i++)
        push(`${label}: ${show(field, JSON.parse(x) as Json)} added`, [...place.path, `+${x}`]);
    return;
  }
  if (JSON.stringify(a) !== JSON.stringify(b)) push(`${words(field)} ${show(field, a)} → ${show(field, b)}`);
}

/** What changed from snapshot `a` to snapshot `b` (empty when they are the same but for the issue time). */
export function diffSnapshots(a: ProposalSnapshot, b: ProposalSnapshot): ProposalChange[] {
  const out: ProposalChange[] = [];
  const { issuedAt: _a, ...left } = a;
  const { issuedAt: _b, ...right } = b;
  walk(left as unknown as Json, right as unknown as Json, '', { path: [], where: [] }, out);
  return out;
}
