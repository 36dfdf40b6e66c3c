import type { Pool as PromisePool } from "mysql2/promise";
import { RateLimiterMySQL } from "rate-limiter-flexible";

import type { RequestHandler } from "express";
import type { Logger } from "pino";

export interface LimitSpec {
  points: number;
  durationSeconds: number;
  /** Once the points are spent, the key stays refused this long (counted from the last point), if set. */
  blockSeconds?: number;
}

/** How long a sign-in from an address the account has used before waits once a failure limit is reached. */
export interface SlowdownSpec {
  firstMs: number;
  maxMs: number;
}

/**
 * Sign-in follows rate-limiter-flexible's documented brute-force pattern: failures only are counted, per account
 * and address together (reset by a success) and per address. The per-account count against guessing from many
 * addresses refuses only addresses that never signed in to the account (server/modules/auth/auth.service.ts).
 */
export interface LimitSettings {
  /** Failed sign-ins from one address, any account. */
  signInPerAddress: LimitSpec;
  /** Consecutive failed sign-ins to one account from one address. */
  signInPerPair: LimitSpec;
  /** Failed sign-ins to one account, from anywhere. */
  signInPerAccount: LimitSpec;
  /** How long an address that signed in to an account is remembered as that account's (refreshed each time). */
  signInKnown: LimitSpec;
  signInSlowdown: SlowdownSpec;
  enquiryPerAddress: LimitSpec;
  enquiryPerVehicle: LimitSpec;
  resetPerAddress: LimitSpec;
  resetPerAccount: LimitSpec;
}

// The sign-in figures are the library's documented example (100 failures a day per address, blocked a day;
// 10 consecutive per account and address, kept 90 days, blocked an hour) and the project's own 8 per account in
// 15 minutes; common practice, no source. Enquiry and reset figures are the project's own.
export const defaultLimits: LimitSettings = {
  signInPerAddress: { points: 100, durationSeconds: 24 * 60 * 60, blockSeconds: 24 * 60 * 60 },
  signInPerPair: { points: 10, durationSeconds: 90 * 24 * 60 * 60, blockSeconds: 60 * 60 },
  signInPerAccount: { points: 8, durationSeconds: 15 * 60 },
  signInKnown: { points: 1, durationSeconds: 90 * 24 * 60 * 60 },
  signInSlowdown: { firstMs: 1000, maxMs: 10_000 },
  enquiryPerAddress: { points: 5, durationSeconds: 10 * 60 },
  enquiryPerVehicle: { points: 30, durationSeconds: 60 * 60 },
  resetPerAddress: { points: 10, durationSeconds: 15 * 60 },
  resetPerAccount: { points: 3, durationSeconds: 60 * 60 },
};

export type Limiter = RateLimiterMySQL & { blockSeconds?: number };
export type Limiters = Record<Exclude<keyof LimitSettings, "signInSlowdown">, Limiter> & { signInSlowdown: SlowdownSpec };

/**
 * Rate-limit counters live in MariaDB (the rate_limits table, created by the migrations), so every server
 * instance counts against the same numbers.
 */
export function createLimiters(pool: PromisePool, database: string, given: Partial<LimitSettings> = defaultLimits): Limiters {
  // Callers that name only some limits (the test worlds) get the defaults for the rest.
  const settings: LimitSettings = { ...defaultLimits, ...given };
  // rate-limiter-flexible speaks mysql2's callback API, which the promise pool wraps.
  const storeClient = (pool as unknown as { pool: unknown }).pool;
  const make = (keyPrefix: string, spec: LimitSpec): Limiter =>
    Object.assign(new RateLimiterMySQL({
      storeClient,
      storeType: "pool",
      dbName: database,
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix,
      points: spec.points,
      duration: spec.durationSeconds,
    }), { blockSeconds: spec.blockSeconds });
  return {
    signInPerAddress: make("sign_in_ip", settings.signInPerAddress),
    signInPerPair: make("sign_in_pair", settings.signInPerPair),
    signInPerAccount: make("sign_in_account", settings.signInPerAccount),
    signInKnown: make("sign_in_known", settings.signInKnown),
    signInSlowdown: settings.signInSlowdown,
    enquiryPerAddress: make("enquiry_ip", settings.enquiryPerAddress),
    enquiryPerVehicle: make("enquiry_vehicle", settings.enquiryPerVehicle),
    resetPerAddress: make("reset_ip", settings.resetPerAddress),
    resetPerAccount: make("reset_account", settings.resetPerAccount),
  };
}

// Spending a point (consume, isBlocked) is in server/lib/rate-limit.ts, where the services reach it.

/**
 * Behind a proxy that TRUST_PROXY does not name, every request comes from the proxy's address, so the limits by
 * address count every client as one. Warned once per process, on the first request that shows it.
 */
export function warnOfUntrustedProxy(logger: Logger, trustProxy: boolean): RequestHandler {
  let warned = trustProxy;
  return (req, _res, next) => {
    if (!warned && req.get("x-forwarded-for") !== undefined) {
      warned = true;
      logger.warn(
        { remoteAddress: req.socket.remoteAddress },
        "requests carry X-Forwarded-For but TRUST_PROXY is off: every client counts as the proxy's address in the sign-in and enquiry limits; set TRUST_PROXY=true behind one proxy",
      );
    }
    next();
  };
}
