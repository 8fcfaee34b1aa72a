import type { RoomInput } from '@calc';
import { randomInt } from 'node:crypto';
import { expect } from 'vitest';
import type request from 'supertest';
import type { Session } from '../helpers/fixtures';
import { isProblem } from '../helpers/fixtures';
import { DESIGN, SITE } from '../helpers/sample-job';

/** Shared by the customers, jobs, rooms, photos and loads tests: small builders over the API. */
export { DESIGN, SITE };

export function sampleRoom(name = 'Living room'): Omit<RoomInput, 'id'> {
  return {
    name,
    lengthFt: 16,
    widthFt: 12,
    ceilingHeightFt: 8,
    exposedWalls: [
      { direction: 'S', lengthFt: 16, windows: [{ widthIn: 36, heightIn: 48, count: 2 }] },
      {
        direction: 'W',
        lengthFt: 12,
        windows: [{ areaFt2: 12, glazing: 'double-low-e' }],
        doors: [{ widthIn: 36, heightIn: 80 }],
      },
    ],
    above: { kind: 'attic', insulation: 'r38' },
    below: { kind: 'crawlspace', vented: true, insulation: 'r19' },
    occupants: 3,
    appliances: [{ label: 'Lamp', gain: 100, unit: 'W' }],
  };
}

export const post = (s: Session, url: string) => s.agent.post(url).set('X-CSRF-Token', s.csrf);
export const patch = (s: Session, url: string, version?: number) => {
  const r = s.agent.patch(url).set('X-CSRF-Token', s.csrf);
  return version === undefined ? r : r.set('If-Match', `"${version}"`);
};
export const del = (s: Session, url: string, version?: number) => {
  const r = s.agent.delete(url).set('X-CSRF-Token', s.csrf);
  return version === undefined ? r : r.set('If-Match', `"${version}"`);
};

export function expectProblem(r: request.Response, status: number): void {
  expect(r.status, JSON.stringify(r.body)).toBe(status);
  expect(isProblem(r)).toBe(true);
}

/** A customer with an e-mail and phone of its own (the same ones twice would be asked "Use the existing customer?"). */
export async function newCustomer(s: Session, name = 'Perpetua Windlestraw'): Promise<string> {
  const n = randomInt(1_000_000, 10_000_000);
  const r = await post(s, '/api/customers').send({ name, email: `perpetua-${n}@example.com`, phone: `555-${n}` });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return String(r.body.customer.id);
}

export interface JobRef {
  id: string;
  version: number;
}

export async function newJob(s: Session, extra: Record<string, unknown> = {}): Promise<JobRef> {
  const customerId = await newCustomer(s);
  const r = await post(s, '/api/jobs').send({ customerId, ...SITE, designConditions: DESIGN, ...extra });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return { id: String(r.body.job.id), version: Number(r.body.job.version) };
}

export async function newRoom(s: Session, jobId: string, input: unknown = sampleRoom()): Promise<JobRef> {
  const r = await post(s, `/api/jobs/${jobId}/rooms`).send({ input });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return { id: String(r.body.room.id), version: Number(r.body.room.version) };
}
