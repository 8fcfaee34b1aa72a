import type { Request, Response } from 'express';
import { ConflictError, PreconditionRequiredError, ValidationError } from './errors';

/**
 * The optimistic-lock protocol for jobs, rooms and company settings: every response that
 * carries a versioned record sends `ETag: "N"` (and `version: N` in the JSON); every
 * update or delete must send `If-Match: "N"` with the version the person edited.
 * No If-Match → 428; a stale one → 409 with `currentVersion` and `current` (the record as
 * it is now) so the client can show both values and let the person choose.
 */
export function ifMatchVersion(req: Request): number {
  const header = req.get('If-Match');
  if (header === undefined || header.trim() === '') {
    throw new PreconditionRequiredError(
      'Send the version you edited in an If-Match header, for example If-Match: "3".',
    );
  }
  const m = /^\s*(?:W\/)?"(\d{1,9})"\s*$/.exec(header);
  if (!m)
    throw new ValidationError([
      { path: 'If-Match', message: 'If-Match must be the quoted version number, for example "3".' },
    ]);
  return Number(m[1]);
}

export function assertVersion(expected: number, actual: number, what: string, current: () => unknown): void {
  if (expected === actual) return;
  throw new ConflictError(
    `${what} was changed by someone else: you edited version ${expected}, it is now at version ${actual}. Compare the values and choose which to keep.`,
    { currentVersion: actual, current: current() },
  );
}

export function setEtag(res: Response, version: number): void {
  res.setHeader('ETag', `"${version}"`);
}
