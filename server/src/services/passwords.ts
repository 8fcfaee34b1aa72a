import argon2 from 'argon2';
import { cpus } from 'node:os';

/** OWASP Password Storage Cheat Sheet, argon2id primary setting: m=19 MiB, t=2, p=1. */
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

// Hashing is bounded to the core count so a sign-in flood cannot take the whole libuv pool.
const limit = Math.max(1, cpus().length);
let running = 0;
const waiting: Array<() => void> = [];

async function withSlot<T>(fn: () => Promise<T>): Promise<T> {
  if (running >= limit) await new Promise<void>((resolve) => waiting.push(resolve));
  running += 1;
  try {
    return await fn();
  } finally {
    running -= 1;
    waiting.shift()?.();
  }
}

export function hashPassword(password: string): Promise<string> {
  return withSlot(() => argon2.hash(password, ARGON2_OPTIONS));
}

export function verifyPassword(hash: string, password: string): Promise<boolean> {
  return withSlot(() => argon2.verify(hash, password).catch(() => false));
}

export function needsRehash(hash: string): boolean {
  return argon2.needsRehash(hash, ARGON2_OPTIONS);
}

// A real hash of a random string: unknown e-mails still cost one verify, so timing does not tell them apart.
let dummy: Promise<string> | undefined;
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword(`unused-${Math.random()}-${Date.now()}`);
  return dummy;
}
