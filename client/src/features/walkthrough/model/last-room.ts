import { getCurrentPerson, personKey } from '../../../lib/offline/person';

/** The room last open on a job, per person on this device: a reload opens it again. */
const keyOf = (jobId: string) => {
  const person = getCurrentPerson();
  return `gaugeline:last-room:v1:${person ? personKey(person) : 'nobody'}:${jobId}`;
};

export function rememberRoom(jobId: string, roomId: string): void {
  try {
    localStorage.setItem(keyOf(jobId), roomId);
  } catch {
    // Storage refused: the first room opens after a reload instead.
  }
}

export function lastRoom(jobId: string): string | null {
  try {
    return localStorage.getItem(keyOf(jobId));
  } catch {
    return null;
  }
}
