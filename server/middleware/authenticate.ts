import type { RequestHandler } from "express";
import type { Session, User } from "lucia";
import type { Auth } from "../modules/auth/lucia.ts";

export interface SignedIn {
  user: User;
  session: Session;
}

declare module "express-serve-static-core" {
  interface Locals {
    /** Set on every /api request: who is signed in, or null. Handlers get the user from route() (server/middleware/route.ts). */
    auth?: SignedIn | null;
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
