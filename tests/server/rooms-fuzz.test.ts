import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isProblem, login, makeCompany, type Session } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { newJob, newRoom, sampleRoom, type JobRef } from './jobs-helpers';

let t: TestApp;
let s: Session;
let job: JobRef;
let room: JobRef;

beforeAll(async () => {
  t = await buildTestApp();
  const a = await makeCompany(t.orm.em.fork(), 'Fuzz');
  s = await login(t.app, a.users.salesperson.email);
  job = await newJob(s);
  room = await newRoom(s, job.id);
});
afterAll(async () => t.close());

type Json = unknown;
const PATHS: ReadonlyArray<ReadonlyArray<string | number>> = [
  ['name'],
  ['lengthFt'],
  ['widthFt'],
  ['areaFt2'],
  ['ceilingHeightFt'],
  ['floorLevel'],
  ['occupants'],
  ['notes'],
  ['achOverride'],
  ['above'],
  ['above', 'kind'],
  ['above', 'insulation'],
  ['below'],
  ['below', 'kind'],
  ['below', 'vented'],
  ['exposedWalls'],
  ['exposedWalls', 0],
  ['exposedWalls', 0, 'direction'],
  ['exposedWalls', 0, 'lengthFt'],
  ['exposedWalls', 0, 'heightFt'],
  ['exposedWalls', 0, 'windows'],
  ['exposedWalls', 0, 'windows', 0, 'widthIn'],
  ['exposedWalls', 0, 'windows', 0, 'count'],
  ['exposedWalls', 0, 'windows', 0, 'uFactor'],
  ['exposedWalls', 1, 'doors', 0, 'heightIn'],
  ['exposedWalls', 5],
  ['appliances'],
  ['appliances', 0, 'gain'],
  ['appliances', 0, 'unit'],
  ['__proto__'],
  ['constructor'],
];

/** Sets `value` at `path` in a deep copy, creating containers on the way. */
function mutate(base: Json, path: ReadonlyArray<string | number>, value: Json): Json {
  const root: Json = structuredClone(base);
  let node: Json = root;
  path.forEach((k, i) => {
    if (typeof node !== 'object' || node === null) return;
    const last = i === path.length - 1;
    const next = last ? value : (Reflect.get(node, k) ?? (typeof path[i + 1] === 'number' ? [] : {}));
    Reflect.defineProperty(node, k, { value: next, enumerable: true, writable: true, configurable: true });
    node = next;
  });
  return root;
}

const oddNumber = fc.oneof(
  fc.double({ noNaN: false }),
  fc.integer(),
  fc.constantFrom(0, -1, 1e308, -1e308, 5e-324, 2 ** 53 + 1, 0.1 + 0.2),
);
const plausible = fc.oneof(
  fc.double({ min: 0, max: 250, noNaN: true }),
  fc.integer({ min: 0, max: 20 }),
  fc.constantFrom('N', 'S', 'r30', 'slab', 'W', 'attic'),
);
const value = fc.oneof(
  { arbitrary: plausible, weight: 3 },
  fc.jsonValue({ maxDepth: 3 }),
  oddNumber,
  fc.string({ maxLength: 300 }),
  fc.constant(null),
);
const mutatedRoom = fc
  .tuple(fc.constantFrom(...PATHS), value)
  .map(([path, v]) => mutate(sampleRoom('Fuzzed'), path, v));
/** Valid rooms with random in-range numbers: these must be stored. */
const tweakedRoom = fc
  .record({
    lengthFt: fc.double({ min: 1, max: 200, noNaN: true }),
    occupants: fc.integer({ min: 0, max: 20 }),
    ceilingHeightFt: fc.double({ min: 8, max: 40, noNaN: true }),
  })
  .map((t) => ({ input: { ...sampleRoom('Tweaked'), ...t } }));
const payload = fc.oneof(
  tweakedRoom,
  fc.jsonValue({ maxDepth: 4 }),
  mutatedRoom.map((input) => ({ input })),
  fc.tuple(mutatedRoom, fc.jsonValue({ maxDepth: 2 })).map(([input, position]) => ({ input, position })),
  fc.dictionary(fc.string({ maxLength: 12 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
);

describe('rooms: 1,000 random payloads', () => {
  it('never answer 5xx; every refusal is problem+json', async () => {
    let version = room.version;
    let accepted = 0;
    await fc.assert(
      fc.asyncProperty(payload, fc.boolean(), async (body, asUpdate) => {
        const text = JSON.stringify(body) ?? 'null';
        const req = asUpdate
          ? s.agent.patch(`/api/jobs/${job.id}/rooms/${room.id}`).set('If-Match', `"${version}"`)
          : s.agent.post(`/api/jobs/${job.id}/rooms`);
        const r = await req.set('X-CSRF-Token', s.csrf).set('Content-Type', 'application/json').send(text);
        expect(r.status, `${r.status} for ${text.slice(0, 300)}: ${JSON.stringify(r.body).slice(0, 300)}`).toBeLessThan(
          500,
        );
        if (r.status >= 400) expect(isProblem(r)).toBe(true);
        else accepted++;
        if (asUpdate && r.status === 200) version = Number(r.body.room.version);
      }),
      { numRuns: 1000 },
    );
    // The mutations of a valid room must reach the happy path too, not only the refusals.
    expect(accepted).toBeGreaterThan(20);
  }, 120_000);
});
