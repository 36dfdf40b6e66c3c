import type { RequestHandler } from "express";
import type { z } from "zod";
import { badRequest } from "../lib/errors.ts";

import { zodFields } from "../../shared/schemas/fields.ts";

export { zodFields };

export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, what = "request"): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    throw badRequest(`Some fields of the ${what} need attention.`, zodFields(result.error));
  }
  return result.data;
}

export type Part = "body" | "query" | "params";

/** What a validator checks, kept on the middleware so the route inventory (tests/support/routes.ts) can read it. */
export interface ValidatorInfo {
  part: Part;
  /** The schema, or a function of the dealership's calendar day that builds it (server/middleware/route.ts). */
  schema: z.ZodType | ((today: string) => z.ZodType);
}

/**
 * The key under which a validator of route() (server/middleware/route.ts) keeps its ValidatorInfo. A symbol and a
 * non-enumerable property, so nothing that copies or logs the function sees it; only code that asks with
 * `validatorInfo()` does.
 */
const VALIDATES = Symbol.for("forthright.validates");

/** The part and schema a validating middleware checks, or undefined for any other function. */
export function validatorInfo(fn: unknown): ValidatorInfo | undefined {
  return typeof fn === "function" ? ((fn as unknown as Record<symbol, ValidatorInfo | undefined>)[VALIDATES] ?? undefined) : undefined;
}

/** Keeps what a validating middleware checks on it, for `validatorInfo()`. */
export function tagValidator(middleware: RequestHandler, part: Part, schema: ValidatorInfo["schema"]): RequestHandler {
  Object.defineProperty(middleware, VALIDATES, { value: { part, schema } satisfies ValidatorInfo, enumerable: false });
  return middleware;
}
