import { RateLimiterPostgres } from 'rate-limiter-flexible';
import type pg from 'pg';
import type { Config } from '../../config';

/**
 * Guessing at proposal links: the openings that fail (a token unknown, altered or ended) are counted per
 * client address in PostgreSQL (table `rate_limit`, shared across processes). Past the limit every opening
 * from that address — a real token too, so the answer tells nothing — waits until the window ends.
 */
export function createLinkOpenLimiter(config: Config, pool: pg.Pool) {
  const perIp = new RateLimiterPostgres({
    storeClient: pool,
    storeType: 'pool',
    tableName: 'rate_limit',
    tableCreated: true,
    keyPrefix: 'link_open_ip',
    points: config.LINK_OPEN_MAX_FAILURES_PER_IP,
    duration: config.LINK_OPEN_WINDOW_SECONDS,
    clearExpiredByTimeout: false,
  });
  return {
    /** Seconds to wait when the address has used up its failures, or 0. */
    async blockedFor(ip: string): Promise<number> {
      const res = await perIp.get(ip);
      if (!res || res.consumedPoints < config.LINK_OPEN_MAX_FAILURES_PER_IP) return 0;
      return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
    },
    async failed(ip: string): Promise<void> {
      await perIp.penalty(ip, 1);
    },
  };
}

export type LinkOpenLimiter = ReturnType<typeof createLinkOpenLimiter>;
