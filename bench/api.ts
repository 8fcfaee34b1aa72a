import { loadConfig } from '../server/src/config';
import { startServer } from '../server/src/server';
import { demoAccounts, isEmpty, seedDemo } from '../fixtures/seed';
import { migrate, withOrm } from '../scripts/lib/db';
import { DEMO, startCluster } from '../scripts/lib/stack';

// API figures on the local demo cluster: sign-in latency (argon2id dominates) and an
// authenticated read under 8 concurrent clients. Loopback only, bounded in time.
const { url } = await startCluster(DEMO);
await migrate(url);
await withOrm(url, async (orm) => {
  if (await isEmpty(orm.em.fork())) await seedDemo(orm.em.fork());
});
const running = await startServer(
  loadConfig({
    ...process.env,
    DATABASE_URL: url,
    PORT: '0',
    LOG_LEVEL: 'silent',
    LOGIN_MAX_PER_IP: '100000',
    LOGIN_MAX_PER_ACCOUNT: '100000',
  }),
);
const base = running.url;

async function session(email: string, password: string): Promise<{ cookie: string; csrf: string }> {
  const pre = await fetch(`${base}/api/auth/csrf`);
  const cookie0 = (pre.headers.get('set-cookie') ?? '').split(';')[0] ?? '';
  const { token } = (await pre.json()) as { token: string };
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: cookie0, 'x-csrf-token': token },
    body: JSON.stringify({ email, password }),
  });
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0] ?? '';
  const csrf = (await (await fetch(`${base}/api/auth/csrf`, { headers: { cookie } })).json()) as { token: string };
  return { cookie, csrf: csrf.token };
}

const pct = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))] ?? NaN;
const owner = demoAccounts.find((a) => a.role === 'owner');
if (!owner) throw new Error('no demo owner');

const loginTimes: number[] = [];
for (let i = 0; i < 20; i++) {
  const t0 = performance.now();
  await session(owner.email, owner.password);
  loginTimes.push(performance.now() - t0);
}
console.log(
  `sign-in (csrf + login + csrf), 20 serial: p50 ${pct(loginTimes, 50).toFixed(1)} ms, p95 ${pct(loginTimes, 95).toFixed(1)} ms`,
);

async function load(path: string, seconds: number, clients: number) {
  const s = await session(owner!.email, owner!.password);
  const times: number[] = [];
  let errors = 0;
  const until = performance.now() + seconds * 1000;
  await Promise.all(
    Array.from({ length: clients }, async () => {
      while (performance.now() < until) {
        const t0 = performance.now();
        const r = await fetch(`${base}${path}`, { headers: { cookie: s.cookie } });
        await r.arrayBuffer();
        if (r.status !== 200) errors += 1;
        times.push(performance.now() - t0);
      }
    }),
  );
  console.log(
    `GET ${path}, ${clients} clients × ${seconds} s: ${(times.length / seconds).toFixed(0)} req/s, p50 ${pct(times, 50).toFixed(1)} ms, p95 ${pct(times, 95).toFixed(1)} ms, p99 ${pct(times, 99).toFixed(1)} ms, non-200 ${errors}`,
  );
}
await load('/api/auth/me', 3, 8);
await load('/api/users', 3, 8);
await running.close();
