import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import { existsSync } from 'node:fs';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function log(message: string): void {
  console.log(`[gaugeline] ${message}`);
}

export function fail(message: string): never {
  console.error(`\n[gaugeline] ${message}\n`);
  process.exit(1);
}

/** Runs a command, throwing with its output when it exits non-zero. */
export function run(cmd: string, args: readonly string[], opts: SpawnSyncOptions = {}): string {
  const r = spawnSync(cmd, args, { encoding: 'utf8', ...opts });
  if (r.error) throw r.error;
  if (r.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} exited ${r.status}\n${r.stdout ?? ''}${r.stderr ?? ''}`);
  }
  return typeof r.stdout === 'string' ? r.stdout : '';
}

let aptUpdated = false;

/** Installs Debian packages when running as root; otherwise stops with what to install. */
export function ensureDebianPackages(packages: readonly string[], why: string, present: () => boolean): void {
  if (present()) return;
  if (!isRoot) {
    fail(
      `${why} is missing. Install it with:\n\n    sudo apt-get install -y ${packages.join(' ')}\n\nthen run the command again.`,
    );
  }
  log(`installing ${packages.join(', ')} from Debian's packages (${why})…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    run('apt-get', ['update', '-qq'], { env, stdio: ['ignore', 'ignore', 'inherit'] });
    aptUpdated = true;
  }
  run('apt-get', ['install', '-y', '-qq', ...packages], { env, stdio: ['ignore', 'ignore', 'inherit'] });
  if (!present()) fail(`${why} is still missing after apt-get install ${packages.join(' ')}.`);
}

export const chromiumPath = '/usr/bin/chromium';

export function ensureChromium(): void {
  ensureDebianPackages(['chromium'], 'Chromium (for the end-to-end tests)', () => existsSync(chromiumPath));
}
