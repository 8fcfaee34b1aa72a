/**
 * The bench's server processes (the real app, the floor): start one under tsx (the app with its
 * production settings: `startApp`), wait until it answers,
 * stop them all, sign in to the app, and read a process's CPU time from /proc. Shared by bench/api.ts
 * and bench/desk.ts.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';

const children: ChildProcess[] = [];

/** `node [nodeArgs] --import tsx script` with `env` over this process's environment; its stdout is dropped. */
export function startProcess(
  script: string,
  env: Record<string, string>,
  cwd = '.',
  nodeArgs: string[] = [],
): ChildProcess {
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', script], {
    cwd,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(child);
  return child;
}

export async function waitFor(url: string): Promise<void> {
  for (let i = 0; i < 300; i += 1) {
    try {
      const r = await fetch(url);
      await r.arrayBuffer();
      if (r.status < 500) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${url} did not answer within 30 s`);
}

/** SIGTERM to every process started here (SIGKILL after 5 s), so a --cpu-prof profile gets written. */
export async function stopAll(): Promise<void> {
  await Promise.all(
    children.map(
      (c) =>
        new Promise<void>((resolve) => {
          if (c.exitCode !== null) return resolve();
          c.once('exit', () => resolve());
          c.kill('SIGTERM');
          setTimeout(() => {
            c.kill('SIGKILL');
            resolve();
          }, 5000).unref();
        }),
    ),
  );
}

/**
 * The real app (`server/src/main.ts` of `serverDir`) in production mode on 127.0.0.1:`port` with a fresh
 * session secret, resolved once it answers its health check; under `node --cpu-prof` when `cpuProfDir` is
 * set. `env` adds to its settings (pool size, rate limits, the queue worker).
 */
export async function startApp(o: {
  port: number;
  databaseUrl: string;
  serverDir: string;
  cpuProfDir: string | null;
  env?: Record<string, string>;
}): Promise<ChildProcess> {
  const app = startProcess(
    'server/src/main.ts',
    {
      NODE_ENV: 'production',
      PORT: String(o.port),
      HOST: '127.0.0.1',
      APP_ORIGIN: `https://127.0.0.1:${o.port}`,
      DATABASE_URL: o.databaseUrl,
      SESSION_SECRET: randomBytes(32).toString('base64url'),
      LOG_LEVEL: 'info',
      ...o.env,
    },
    o.serverDir,
    o.cpuProfDir ? ['--cpu-prof', `--cpu-prof-dir=${o.cpuProfDir}`] : [],
  );
  await waitFor(`http://127.0.0.1:${o.port}/api/health`);
  return app;
}

export const cookieOf = (setCookie: string | string[] | undefined | null) =>
  (Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : []).map((c) => c.split(';')[0] ?? '').join('; ');

/** A signed-in session on the app at `base`: its cookie and a CSRF token for writes. */
export async function signIn(base: string, email: string, password: string): Promise<{ cookie: string; csrf: string }> {
  const pre = await fetch(`${base}/api/auth/csrf`, { headers: { 'x-forwarded-proto': 'https' } });
  const { token } = (await pre.json()) as { token: string };
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      cookie: cookieOf(pre.headers.getSetCookie()),
      'x-csrf-token': token,
      'x-forwarded-proto': 'https',
    },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
  const cookie = cookieOf(res.headers.getSetCookie());
  const csrf = (await (
    await fetch(`${base}/api/auth/csrf`, { headers: { cookie, 'x-forwarded-proto': 'https' } })
  ).json()) as { token: string };
  return { cookie, csrf: csrf.token };
}

/**
 * CPU time a process has used so far (user + system, ms), from /proc (Linux; NaN elsewhere). Per request
 * it says what the route costs the server whatever else the machine runs: on a loaded machine latencies
 * wait for the CPU, but the CPU a request needs hardly changes. Resolution: one clock tick (10 ms), so
 * divide a run of many requests.
 */
export function cpuMs(pid: number | undefined): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // utime and stime are fields 14 and 15 of stat(5), in clock ticks (USER_HZ, 100 on Linux).
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
  } catch {
    return Number.NaN;
  }
}
