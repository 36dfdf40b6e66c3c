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

/**
 * Counts one failure against the key; at the limit, refuses the key for the limiter's block time (if it has one and
 * `block` is not false; a key that is only slowed keeps counting instead).
 */
export async function countFailure(limiter: RateLimiterAbstract & { blockSeconds?: number }, key: string, block = true): Promise<void> {
  const res = await limiter.penalty(key, 1);
  if (block && limiter.blockSeconds && res.consumedPoints >= limiter.points) await limiter.block(key, limiter.blockSeconds);
}

/** A 429 for a spent limit: the message, then how long to wait (in minutes, and in Retry-After). */
export function refusal(res: RateLimiterRes, message: string) {
  const wait = minutes(res.msBeforeNext);
  return tooMany(`${message} Wait ${wait} minute${wait === 1 ? "" : "s"} and try again.`, Math.ceil(res.msBeforeNext / 1000));
}

/** Failures beyond a limit, or 0 below it: how far a key is into its slow-down. */
export async function overBy(limiter: RateLimiterAbstract, key: string): Promise<number> {
  const res = await limiter.get(key);
  return res ? Math.max(0, res.consumedPoints - limiter.points + 1) : 0;
}
