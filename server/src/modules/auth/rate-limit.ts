import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type pg from 'pg';
import type { Config } from '../../config';
import { RateLimitedError } from '../../lib/errors';

/**
 * Failed sign-ins are counted per account and per client IP in PostgreSQL (table `rate_limit`,
 * from a migration), so the limit holds across server processes.
 */
export function createLoginLimiter(config: Config, pool: pg.Pool) {
  const common = {
    storeClient: pool,
    storeType: 'pool',
    tableName: 'rate_limit',
    tableCreated: true,
    duration: config.LOGIN_WINDOW_SECONDS,
    clearExpiredByTimeout: false,
  };
  const perAccount = new RateLimiterPostgres({
    ...common,
    keyPrefix: 'login_acct',
    points: config.LOGIN_MAX_PER_ACCOUNT,
  });
  const perIp = new RateLimiterPostgres({ ...common, keyPrefix: 'login_ip', points: config.LOGIN_MAX_PER_IP });

  const blockedFor = (r: RateLimiterRes | null, max: number) =>
    r && r.consumedPoints >= max ? Math.max(1, Math.ceil(r.msBeforeNext / 1000)) : 0;

  return {
    async assertAllowed(email: string, ip: string): Promise<void> {
      const [a, i] = await Promise.all([perAccount.get(email), perIp.get(ip)]);
      const wait = Math.max(blockedFor(a, config.LOGIN_MAX_PER_ACCOUNT), blockedFor(i, config.LOGIN_MAX_PER_IP));
      if (wait > 0) throw new RateLimitedError(wait);
    },
    async recordFailure(email: string, ip: string): Promise<void> {
      await Promise.all([perAccount.penalty(email, 1), perIp.penalty(ip, 1)]);
    },
    async recordSuccess(email: string): Promise<void> {
      await perAccount.delete(email);
    },
  };
}

export type LoginLimiter = ReturnType<typeof createLoginLimiter>;
