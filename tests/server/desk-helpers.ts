import type { EntityManager } from '@mikro-orm/postgresql';
import { expect } from 'vitest';
import type { Session } from '../helpers/fixtures';
import { newJob, newRoom, post, sampleRoom, type JobRef } from './jobs-helpers';
import { seedData } from './company-data-helpers';

export { seedData };

/** A job of `s` with three rooms; returns the job and the room ids. */
export async function deskJob(s: Session): Promise<{ job: JobRef; rooms: string[] }> {
  const job = await newJob(s, { house: { bedrooms: 2 } });
  const rooms: string[] = [];
  for (const name of ['Living room', 'Main bedroom', 'Office'])
    rooms.push((await newRoom(s, job.id, sampleRoom(name))).id);
  return { job, rooms };
}

/** One room on a 12k single-zone pair from the demo catalog. */
export function singleZone(roomId: string, lengthFt = 30) {
  return {
    zones: [{ key: 'z1', name: 'Living', roomIds: [roomId], indoorUnitKey: 'TSL-S12H-W' }],
    systems: [
      {
        key: 's1',
        name: 'Living system',
        outdoorUnitKey: 'TSL-S12H-O',
        circuits: [{ zoneKey: 'z1', lengthFt }],
        electrical: { circuitLengthFt: 40 },
      },
    ],
  };
}

/** Three rooms on a 3-port multi-zone with wall heads from the demo catalog. */
export function multiZone(rooms: string[], lengths = [25, 35, 45]) {
  const heads = ['TSL-MH12-W', 'TSL-MH9-W', 'TSL-MH9-W'];
  return {
    zones: rooms.map((id, i) => ({
      key: `z${i + 1}`,
      name: `Zone ${i + 1}`,
      roomIds: [id],
      indoorUnitKey: heads[i] ?? 'TSL-MH9-W',
    })),
    systems: [
      {
        key: 's1',
        name: 'Whole-home system',
        outdoorUnitKey: 'TSL-M24-3P',
        circuits: rooms.map((_, i) => ({ zoneKey: `z${i + 1}`, lengthFt: lengths[i] ?? 25 })),
        electrical: { circuitLengthFt: 50 },
      },
    ],
  };
}

export async function newOption(s: Session, jobId: string, body: Record<string, unknown>) {
  const r = await post(s, `/api/jobs/${jobId}/options`).send(body);
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.option as { id: string; version: number } & Record<string, unknown>;
}

export async function companyWithData(em: EntityManager, companyId: string): Promise<void> {
  await seedData(em, companyId);
}
