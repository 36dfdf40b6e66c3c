import type { Request, RequestHandler } from "express";
import { AppError } from "../lib/errors.ts";

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Paths (as the router sees them) whose writes carry their own proof instead of a browser's Origin. Empty for now;
 * the payments webhook (its own issue) goes here, because the provider's signature over the body is its check and
 * the provider sends no Origin. Never add a path that a session cookie can reach.
 */
export const ORIGIN_EXEMPT: readonly string[] = [];

export interface OriginCheckOptions {
  /** Origins whose pages may write: PUBLIC_URL's and ALLOWED_ORIGINS (config.allowedOrigins). */
  origins: string[];
  exempt?: readonly string[];
}

const refused = () => new AppError(403, "cross_origin", "This request did not come from Forthright's own pages, so it was refused.");

/**
 * The address the connection arrived on, as an origin. It is not the client's to choose, and no other site can
 * serve pages from it, so a page loaded from it (or a local reverse proxy, whose default Host it is) is ours.
 */
function socketOrigin(req: Request): string | null {
  const address = req.socket.localAddress?.replace(/^::ffff:/, "");
  const port = req.socket.localPort;
  if (!address || !port) return null;
  const scheme = "encrypted" in req.socket && req.socket.encrypted ? "https" : "http";
  return new URL(`${scheme}://${address.includes(":") ? `[${address}]` : address}:${port}`).origin;
}

function parsedOrigin(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * CSRF and DNS-rebinding defence for cookie sessions. A state-changing request must be addressed to one of our
 * hosts (the Host header names the site the browser thinks it is talking to; a rebinding attacker's name is refused)
 * and come from one of our origins, compared exactly (scheme, host and port) and never with Host, which the client
 * writes. Without Origin, a browser's Sec-Fetch-Site: same-origin counts, since the Host check has already held.
 * Requests carrying neither are refused (fail closed).
 */
export function originCheck(options: OriginCheckOptions): RequestHandler {
  const configured = new Set(options.origins.map((o) => new URL(o).origin));
  const exempt = new Set(options.exempt ?? ORIGIN_EXEMPT);
  return (req, _res, next) => {
    if (SAFE.has(req.method) || exempt.has(req.path)) return next();
    const own = socketOrigin(req);
    const allowed = (origin: string | null) => origin !== null && (configured.has(origin) || origin === own);
    const origins = [...configured, own].filter((o): o is string => o !== null);
    // Compared with each allowed origin's host (host and port; the scheme is not in Host).
    const host = req.get("host")?.toLowerCase();
    if (!host || !origins.some((o) => new URL(o).host === host)) throw refused();
    const origin = req.get("origin");
    if (origin !== undefined) {
      if (origin !== "null" && allowed(parsedOrigin(origin))) return next();
      throw refused();
    }
    if (req.get("sec-fetch-site") === "same-origin") return next();
    throw refused();
  };
}
