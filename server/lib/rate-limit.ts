import type { RateLimiterAbstract } from "rate-limiter-flexible";
import { RateLimiterRes } from "rate-limiter-flexible";
import { tooMany } from "./errors.ts";

// The limiters themselves are made at boot (server/middleware/rate-limit.ts createLimiters); services spend them here.

const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60_000));

/** Consumes one point, or throws a 429 whose message says how long to wait. */
export async function consume(limiter: RateLimiterAbstract, key: string, what: string): Promise<void> {
  try {
    await limiter.consume(key);
  } catch (e) {
    if (e instanceof RateLimiterRes) {
      const wait = minutes(e.msBeforeNext);
      throw tooMany(`Too many ${what}. Wait ${wait} minute${wait === 1 ? "" : "s"} and try again.`, Math.ceil(e.msBeforeNext / 1000));
    }
    throw e;
  }
}

/** The limiter's state for the key when its points are spent, else null; spends nothing. */
export async function isBlocked(limiter: RateLimiterAbstract, key: string): Promise<RateLimiterRes | null> {
  const res = await limiter.get(key);
  return res && res.consumedPoints >= limiter.points ? res : null;
}
