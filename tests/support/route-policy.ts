/**
 * Who may call which route: each route of the inventory names the action of shared/permissions.ts its guard must
 * check (or "anyone"), and the callers the security matrix (tests/api/security.test.ts) expects to get past the guard
 * are computed from that table (`rolesFor`), so the matrix and the server are built from the one table. The fuzzer
 * (tests/api/fuzz.test.ts) signs in as a caller the route admits.
 *
 * Staff-only routes answer 401 to the public and 403 to a staff role the action does not list; "anyone" admits the
 * public and every role. Every route of the inventory needs an entry here, and every entry a route: the matrix fails
 * otherwise; and the guard the router holds must check the action named here.
 */
import { ROLES, type Role } from "../../shared/constants/roles.ts";
import { rolesFor } from "../../shared/permissions.ts";
import type { Allow } from "../../server/middleware/route.ts";

export type Caller = "public" | Role;
export const CALLERS: readonly Caller[] = ["public", ...ROLES];

export const ROUTE_POLICY: Record<string, Allow> = {
  "GET /api/health": "anyone",

  "POST /api/auth/sign-in": "anyone",
  "POST /api/auth/sign-out": "staff.enter",
  "POST /api/auth/password-reset": "anyone",
  "POST /api/auth/password-reset/confirm": "anyone",
  "GET /api/auth/invitations/:token": "anyone",
  "POST /api/auth/invitations/accept": "anyone",
  "GET /api/auth/session": "anyone",

  "GET /api/users": "users.manage",
  "POST /api/users": "users.manage",
  "POST /api/users/invite": "users.manage",
  "PATCH /api/users/:id": "users.manage",

  "GET /api/dealership": "dealership.read",
  "PATCH /api/dealership": "dealership.edit",

  "GET /api/vehicles/:id/photos/limits": "vehicles.read",
  "GET /api/vehicles/:id/photos": "vehicles.read",
  "POST /api/vehicles/:id/photos": "evidence.write",
  "PATCH /api/vehicles/:id/photos/:photoId": "evidence.write",
  "PUT /api/vehicles/:id/photos/order": "evidence.write",
  "DELETE /api/vehicles/:id/photos/:photoId": "evidence.write",

  "GET /api/vehicles/:id/walkaround": "vehicles.read",
  "PUT /api/vehicles/:id/walkaround/zones": "evidence.write",
  "POST /api/vehicles/:id/defects": "evidence.write",
  "PATCH /api/vehicles/:id/defects/:defectId": "evidence.write",
  "DELETE /api/vehicles/:id/defects/:defectId": "evidence.write",

  "GET /api/vehicles/:id/checks": "vehicles.read",
  "PUT /api/vehicles/:id/tyres": "evidence.write",
  "PUT /api/vehicles/:id/checks": "evidence.write",

  "POST /api/vehicles/:id/publish": "vehicle.publish",
  "POST /api/vehicles/:id/share": "vehicle.share",

  "GET /api/vehicles": "vehicles.read",
  "GET /api/vehicles/suggestions": "vehicles.read",
  "POST /api/vehicles": "vehicle.create",
  "GET /api/vehicles/:id": "vehicles.read",
  "GET /api/vehicles/:id/evidence": "vehicles.read",
  "GET /api/vehicles/:id/history": "vehicles.read",
  // Every staff role may save a vehicle; which fields each may change is checked inside (403 forbidden_fields).
  "PATCH /api/vehicles/:id": "vehicle.edit",
  // Which move each role may make is checked inside (shared/domain/status.ts); the route admits whoever makes any.
  "POST /api/vehicles/:id/status": "vehicle.status.move",

  "GET /api/public/dealership": "anyone",
  "GET /api/public/vehicles": "anyone",
  "GET /api/public/vehicles/:slug": "anyone",
  "GET /api/public/vehicles/:slug/revisions/:number": "anyone",
  "GET /api/public/vehicles/:slug/qr.svg": "anyone",
  "POST /api/public/vehicles/:slug/enquiries": "anyone",
  "GET /api/public/finance-estimate": "anyone",

  "GET /api/leads/stats": "leads.stats",
  "GET /api/leads": "leads.read",
  "GET /api/leads/:id": "leads.read",
  "PATCH /api/leads/:id": "leads.work",
  "POST /api/leads/:id/messages": "leads.work",

  "GET /api/mail/outbox": "mail.read",
  "POST /api/mail/outbox/retry": "mail.retry",
  "GET /api/mail/captured": "mail.read",
  "GET /api/mail/captured/:id": "mail.read",
  "GET /api/mail/captured/:id/html": "mail.read",

  "GET /api/feeds": "feeds.manage",
  "POST /api/feeds": "feeds.manage",
  "POST /api/feeds/preview": "feeds.manage",
  "GET /api/feeds/:id": "feeds.manage",
  "PATCH /api/feeds/:id": "feeds.manage",
  "POST /api/feeds/:id/rotate": "feeds.manage",
  "DELETE /api/feeds/:id": "feeds.manage",
  "GET /api/feeds/:id/download": "feeds.manage",

  // Public pages and files outside /api: anyone (the staff SPA's own guard sends the signed-out to /sign-in).
  "GET /media/{*key}": "anyone",
  "GET /vehicles/:slug": "anyone",
  "GET /vehicles/:slug/card": "anyone",
  "GET /vehicles/:slug/revisions/:n": "anyone",
  "GET /sitemap.xml": "anyone",
  "GET /favicon.ico": "anyone",
  "GET /robots.txt": "anyone",
  "GET /feeds/:file": "anyone",
  "GET /{*splat}": "anyone",
};

/** The callers an Allow admits: the public and every role for "anyone", else the roles the permissions table lists. */
export const callersAllowed = (allow: Allow): readonly Caller[] => (allow === "anyone" ? CALLERS : rolesFor(allow));

/** The callers a route admits, from its policy entry. */
export function callersOf(key: string): readonly Caller[] {
  const allow = ROUTE_POLICY[key];
  if (!allow) throw new Error(`no policy for ${key}`);
  return callersAllowed(allow);
}

/** A caller the route admits, preferring the least privileged staff role, for requests that should get past the guard. */
export function callerFor(key: string): Caller {
  const allowed = callersOf(key);
  for (const c of ["public", "marketing", "workshop", "sales", "admin"] as const) if (allowed.includes(c)) return c;
  return allowed[0];
}
