import type { RequestHandler } from "express";
import type { Session, User } from "lucia";
import type { Auth } from "../modules/auth/lucia.ts";
import { forbidden, unauthorized } from "../lib/errors.ts";
import type { Role } from "../../shared/constants/roles.ts";

export interface SignedIn {
  user: User;
  session: Session;
}

declare module "express-serve-static-core" {
  interface Locals {
    auth?: SignedIn | null;
    body?: unknown;
    query?: unknown;
    params?: unknown;
  }
}

/**
 * Reads the session cookie on every request (sessions live in MariaDB, so any instance can answer), extends a
 * session that lucia marks fresh, and clears a cookie whose session is gone or whose user was deactivated.
 */
export function loadSession(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const id = auth.readSessionCookie(req.headers.cookie ?? "");
    res.locals.auth = null;
    if (!id) return next();
    const { session, user } = await auth.validateSession(id);
    if (!session || !user || !user.active) {
      if (session) await auth.invalidateSession(session.id);
      res.append("Set-Cookie", auth.createBlankSessionCookie().serialize());
      return next();
    }
    if (session.fresh) res.append("Set-Cookie", auth.createSessionCookie(session.id).serialize());
    res.locals.auth = { session, user };
    next();
  };
}

/** 401 when nobody is signed in; 403 when the signed-in role is not among those allowed. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (_req, res, next) => {
    const auth = res.locals.auth;
    if (!auth) throw unauthorized();
    if (roles.length && !roles.includes(auth.user.role)) throw forbidden();
    next();
  };
}

export const requireStaff = requireRole();

/** The signed-in user of a request that passed requireRole. */
export function currentUser(locals: { auth?: SignedIn | null }): User {
  if (!locals.auth) throw unauthorized();
  return locals.auth.user;
}
