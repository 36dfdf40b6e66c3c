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

type Part = "body" | "query" | "params";

/**
 * Validates one part of the request and keeps the parsed value on `res.locals[part]` (Express 5 makes
 * `req.query` read-only), so handlers read typed input and never the raw request.
 */
export function validate<S extends z.ZodType>(part: Part, schema: S): RequestHandler {
  return (req, res, next) => {
    res.locals[part] = parseOr400(schema, req[part] ?? {}, part === "body" ? "form" : part);
    next();
  };
}
