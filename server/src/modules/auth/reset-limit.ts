import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type pg from 'pg';
import type { Config } from '../../config';
import { RateLimitedError } from '../../lib/errors';

/**
 * "Forgot password" requests are counted per address and per client IP in PostgreSQL (table
 * `rate_limit`, shared across processes). The address is counted whether or not an account uses it,
 * so the limit answers the same for both.
 */
export function createResetLimiter(config: Config, pool: pg.Pool) {
  const common = {
    storeClient: pool,
    storeType: 'pool',
    tableName: 'rate_limit',
    tableCreated: true,
    duration: config.RESET_WINDOW_SECONDS,
    clearExpiredByTimeout: false,
  };
  const perAccount = new RateLimiterPostgres({
    ...common,
    keyPrefix: 'reset_acct',
    points: config.RESET_MAX_PER_ACCOUNT,
  });
  const perIp = new RateLimiterPostgres({ ...common, keyPrefix: 'reset_ip', points: config.RESET_MAX_PER_IP });

  const consume = async (limiter: RateLimiterPostgres, key: string) => {
    try {
      await limiter.consume(key, 1);
    } catch (e) {
      if (e instanceof RateLimiterRes) throw new RateLimitedError(Math.max(1, Math.ceil(e.msBeforeNext / 1000)));
      throw e;
    }
  };

  return {
    async consume(email: string, ip: string): Promise<void> {
      await consume(perIp, ip);
      await consume(perAccount, email);
    },
  };
}

export type ResetLimiter = ReturnType<typeof createResetLimiter>;
