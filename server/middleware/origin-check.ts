import type { RequestHandler } from "express";
import { AppError } from "../lib/errors.ts";

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * CSRF defence for cookie sessions: a state-changing request must come from our own origin, shown by the
 * Origin header or, failing that, by Sec-Fetch-Site. Requests carrying neither are refused (fail closed).
 */
export function originCheck(allowedOrigins: string[]): RequestHandler {
  const allowed = new Set(allowedOrigins.map((o) => new URL(o).origin));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get("origin");
    const host = req.get("host");
    if (origin && origin !== "null") {
      let parsed: URL | null;
      try {
        parsed = new URL(origin);
      } catch {
        parsed = null;
      }
      if (parsed && (allowed.has(parsed.origin) || parsed.host === host)) return next();
    } else {
      const site = req.get("sec-fetch-site");
      if (site === "same-origin") return next();
    }
    throw new AppError(403, "cross_origin", "This request did not come from Forthright's own pages, so it was refused.");
  };
}
