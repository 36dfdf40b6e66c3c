import type { Pool as PromisePool } from "mysql2/promise";
import { RateLimiterMySQL } from "rate-limiter-flexible";

export interface LimitSpec {
  points: number;
  durationSeconds: number;
}

export interface LimitSettings {
  signInPerAddress: LimitSpec;
  signInPerAccount: LimitSpec;
  enquiryPerAddress: LimitSpec;
  enquiryPerVehicle: LimitSpec;
  resetPerAddress: LimitSpec;
  resetPerAccount: LimitSpec;
}

export const defaultLimits: LimitSettings = {
  signInPerAddress: { points: 30, durationSeconds: 15 * 60 },
  signInPerAccount: { points: 8, durationSeconds: 15 * 60 },
  enquiryPerAddress: { points: 5, durationSeconds: 10 * 60 },
  enquiryPerVehicle: { points: 30, durationSeconds: 60 * 60 },
  resetPerAddress: { points: 10, durationSeconds: 15 * 60 },
  resetPerAccount: { points: 3, durationSeconds: 60 * 60 },
};

export type Limiter = RateLimiterMySQL;
export type Limiters = Record<keyof LimitSettings, Limiter>;

/**
 * Rate-limit counters live in MariaDB (the rate_limits table, created by the migrations), so every server
 * instance counts against the same numbers.
 */
export function createLimiters(pool: PromisePool, database: string, settings: LimitSettings = defaultLimits): Limiters {
  // rate-limiter-flexible speaks mysql2's callback API, which the promise pool wraps.
  const storeClient = (pool as unknown as { pool: unknown }).pool;
  const make = (keyPrefix: string, spec: LimitSpec) =>
    new RateLimiterMySQL({
      storeClient,
      storeType: "pool",
      dbName: database,
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix,
      points: spec.points,
      duration: spec.durationSeconds,
    });
  return {
    signInPerAddress: make("sign_in_ip", settings.signInPerAddress),
    signInPerAccount: make("sign_in_account", settings.signInPerAccount),
    enquiryPerAddress: make("enquiry_ip", settings.enquiryPerAddress),
    enquiryPerVehicle: make("enquiry_vehicle", settings.enquiryPerVehicle),
    resetPerAddress: make("reset_ip", settings.resetPerAddress),
    resetPerAccount: make("reset_account", settings.resetPerAccount),
  };
}

// Spending a point (consume, isBlocked) is in server/lib/rate-limit.ts, where the services reach it.
