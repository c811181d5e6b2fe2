import { ipKeyGenerator } from 'express-rate-limit';
import type { Redis } from 'ioredis';
import { RateLimiterMemory, RateLimiterRedis, RateLimiterRes } from 'rate-limiter-flexible';

/**
 * Failed sign-ins allowed per 15 minutes (README "Sign-in limits" says why these numbers):
 * - per address 30: an office behind one NAT address, a dozen people mistyping, still fits;
 *   a spray of many e-mails from one address stops after 30 hashes.
 * - per account 10, counted across all addresses: slows a distributed guess at one account to
 *   40 an hour; the price is that someone can keep an account locked for 15 minutes at a time.
 */
export const LOGIN_LIMITS = {
  perAddress: { points: 30, duration: 15 * 60 },
  perAccount: { points: 10, duration: 15 * 60 },
} as const;

const KEY_PREFIX = { perAddress: 'timefield:login:address', perAccount: 'timefield:login:account' } as const;

export interface LoginLimits {
  /**
   * Reserves one attempt for this address and account before any hashing; returns the seconds to
   * wait when either is used up. Redis keeps the counters, so every API process shares them.
   */
  reserve(ip: string, email: string): Promise<number | null>;
  /** A correct sign-in gives the address its attempt back and clears the account's failures. */
  succeeded(ip: string, email: string): Promise<void>;
}

function limiter(redis: Redis, which: keyof typeof LOGIN_LIMITS) {
  const { points, duration } = LOGIN_LIMITS[which];
  return new RateLimiterRedis({
    storeClient: redis,
    keyPrefix: KEY_PREFIX[which],
    points,
    duration,
    // Redis down: each process counts in memory until it is back, rather than letting everyone through.
    insuranceLimiter: new RateLimiterMemory({ points, duration }),
  });
}

export function createLoginLimits(redis: Redis): LoginLimits {
  const byAddress = limiter(redis, 'perAddress');
  const byAccount = limiter(redis, 'perAccount');
  const addressKey = (ip: string) => ipKeyGenerator(ip); // IPv6: the whole /56 counts as one address
  const accountKey = (email: string) => email.trim().toLowerCase();
  return {
    async reserve(ip, email) {
      const results = await Promise.allSettled([byAddress.consume(addressKey(ip)), byAccount.consume(accountKey(email))]);
      const waits = results.map((r) => (r.status === 'rejected' ? wait(r.reason) : 0));
      const longest = Math.max(...waits);
      return longest > 0 ? longest : null;
    },
    async succeeded(ip, email) {
      await Promise.allSettled([byAddress.reward(addressKey(ip), 1), byAccount.delete(accountKey(email))]);
    },
  };
}

function wait(reason: unknown): number {
  if (reason instanceof RateLimiterRes) return Math.max(1, Math.ceil(reason.msBeforeNext / 1000));
  throw reason; // not a limit: a store error the insurance limiter could not absorb
}

/** Test helper: forget every sign-in counter (the test world is rebuilt per file, Redis is not). */
export async function clearLoginLimits(redis: Redis): Promise<void> {
  for (const prefix of Object.values(KEY_PREFIX)) {
    const keys = await redis.keys(`${prefix}:*`);
    if (keys.length) await redis.del(...keys);
  }
}
