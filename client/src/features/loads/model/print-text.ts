import type { JobRecord, RoomRecord } from '@contract';

/**
 * The summary's revision: a short code made from the job's version and every room's id and version, so
 * it changes whenever a room is added, edited or removed (a room's own version does not move on removal,
 * and the job's does not move on room edits, so neither alone will do). FNV-1a, 32 bits, six hex digits.
 */
export function summaryRevision(
  job: Pick<JobRecord, 'id' | 'version'>,
  rooms: readonly Pick<RoomRecord, 'id' | 'version'>[],
) {
  const text = [`${job.id}:${job.version}`, ...rooms.map((r) => `${r.id}:${r.version}`).sort()].join('|');
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).toUpperCase().padStart(8, '0').slice(0, 6);
}

/** When the job or any room last changed (ISO), for the summary's "figures as of" date. */
export function lastChanged(job: Pick<JobRecord, 'updatedAt'>, rooms: readonly Pick<RoomRecord, 'updatedAt'>[]) {
  return [job.updatedAt, ...rooms.map((r) => r.updatedAt)].reduce((a, b) => (b > a ? b : a));
}

/**
 * Text for a customer's copy: drops the office's source tags ("[MEM: …]", "[PUB: …]", "[TRADE …]",
 * "[OWN]") that calc's strings carry, and the space they leave.
 */
export function withoutSourceTags(text: string): string {
  return text
    .replace(/\s*\[(?:MEM|PUB|TRADE|OWN)[^\]]*\]/g, '')
    .replace(/\s+([.,;)])/g, '$1')
    .trim();
}
