import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { randomUUID } from 'node:crypto';

/**
 * Where uploaded bytes live. Keys are opaque ids the server makes (never a user's file
 * name). Local disk by default; an S3-compatible store implements the same three calls
 * (PutObject with ContentType, GetObject returning null on NoSuchKey, DeleteObject).
 */
export interface Storage {
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
  /** The stored bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<Buffer | null>;
  /** Removing a missing key is not an error. */
  delete(key: string): Promise<void>;
}

const KEY = /^[a-z0-9][a-z0-9-]{7,63}$/;

function assertKey(key: string): void {
  // Keys come from the server, but a key is a path segment here, so refuse anything else.
  if (!KEY.test(key)) throw new Error('Invalid storage key');
}

const isMissing = (e: unknown): boolean => typeof e === 'object' && e !== null && 'code' in e && e.code === 'ENOENT';

/** Files under `root/<first two characters>/<key>`; writes go to a temp file and are renamed into place. */
export function createLocalDiskStorage(root: string): Storage {
  const base = resolve(root);
  const pathOf = (key: string) => join(base, key.slice(0, 2), key);
  return {
    async put(key, bytes) {
      assertKey(key);
      const target = pathOf(key);
      await mkdir(dirname(target), { recursive: true });
      const tmp = `${target}.${randomUUID()}.tmp`;
      await writeFile(tmp, bytes, { mode: 0o600 });
      await rename(tmp, target);
    },
    async get(key) {
      assertKey(key);
      try {
        return await readFile(pathOf(key));
      } catch (e) {
        if (isMissing(e)) return null;
        throw e;
      }
    },
    async delete(key) {
      assertKey(key);
      await rm(pathOf(key), { force: true });
    },
  };
}
