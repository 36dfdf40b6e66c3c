/**
 * Who may call which route: the policy the security matrix (tests/api/security.test.ts) checks every route of the
 * inventory against, and the fuzzer (tests/api/fuzz.test.ts) uses to sign in as someone the route admits.
 *
 * Derived from the requireRole()/requireStaff calls in server/modules/* and the product's roles
 * (../shared/PRODUCT.md; shared/constants/roles.ts): admin has everything; sales works vehicles, evidence,
 * publishing and enquiries; workshop records evidence but cannot publish, price or work leads; marketing reads stock,
 * edits listing copy (a field-level rule inside PATCH /api/vehicles/:id, not a route rule) and manages feeds, and sees
 * lead counts only. Staff-only routes answer 401 to the public and 403 to a staff role not listed.
 *
 * Every route of the inventory needs an entry here, and every entry a route: the matrix fails otherwise.
 */
import { ROLES, type Role } from "../../shared/constants/roles.ts";

export type Caller = "public" | Role;
export const CALLERS: readonly Caller[] = ["public", ...ROLES];

const EVERYONE: readonly Caller[] = CALLERS;
const STAFF: readonly Caller[] = ROLES;
const ADMIN: readonly Caller[] = ["admin"];
const ADMIN_SALES: readonly Caller[] = ["admin", "sales"];
const EVIDENCE: readonly Caller[] = ["admin", "sales", "workshop"];
const FEEDS: readonly Caller[] = ["admin", "marketing"];

export const ROUTE_POLICY: Record<string, readonly Caller[]> = {
  "GET /api/health": EVERYONE,

  "POST /api/auth/sign-in": EVERYONE,
  "POST /api/auth/sign-out": STAFF,
  "POST /api/auth/password-reset": EVERYONE,
  "POST /api/auth/password-reset/confirm": EVERYONE,
  "GET /api/auth/invitations/:token": EVERYONE,
  "POST /api/auth/invitations/accept": EVERYONE,
  "GET /api/auth/session": EVERYONE,

  "GET /api/users": ADMIN,
  "POST /api/users": ADMIN,
  "POST /api/users/invite": ADMIN,
  "PATCH /api/users/:id": ADMIN,

  "GET /api/dealership": STAFF,
  "PATCH /api/dealership": ADMIN,

  "GET /api/vehicles/:id/photos/limits": STAFF,
  "GET /api/vehicles/:id/photos": STAFF,
  "POST /api/vehicles/:id/photos": EVIDENCE,
  "PATCH /api/vehicles/:id/photos/:photoId": EVIDENCE,
  "PUT /api/vehicles/:id/photos/order": EVIDENCE,
  "DELETE /api/vehicles/:id/photos/:photoId": EVIDENCE,

  "GET /api/vehicles/:id/walkaround": STAFF,
  "PUT /api/vehicles/:id/walkaround/zones": EVIDENCE,
  "POST /api/vehicles/:id/defects": EVIDENCE,
  "PATCH /api/vehicles/:id/defects/:defectId": EVIDENCE,
  "DELETE /api/vehicles/:id/defects/:defectId": EVIDENCE,

  "GET /api/vehicles/:id/checks": STAFF,
  "PUT /api/vehicles/:id/tyres": EVIDENCE,
  "PUT /api/vehicles/:id/checks": EVIDENCE,

  "POST /api/vehicles/:id/publish": ADMIN_SALES,
  "POST /api/vehicles/:id/share": ADMIN_SALES,

  "GET /api/vehicles": STAFF,
  "GET /api/vehicles/suggestions": STAFF,
  "POST /api/vehicles": ADMIN_SALES,
  "GET /api/vehicles/:id": STAFF,
  "GET /api/vehicles/:id/history": STAFF,
  // Every staff role may save a vehicle; which fields each may change is checked inside (403 forbidden_fields).
  "PATCH /api/vehicles/:id": STAFF,
  "POST /api/vehicles/:id/status": EVIDENCE,

  "GET /api/public/dealership": EVERYONE,
  "GET /api/public/vehicles": EVERYONE,
  "GET /api/public/vehicles/:slug": EVERYONE,
  "GET /api/public/vehicles/:slug/revisions/:number": EVERYONE,
  "GET /api/public/vehicles/:slug/qr.svg": EVERYONE,
  "POST /api/public/vehicles/:slug/enquiries": EVERYONE,

  "GET /api/leads/stats": ["admin", "sales", "marketing"],
  "GET /api/leads": ADMIN_SALES,
  "GET /api/leads/:id": ADMIN_SALES,
  "PATCH /api/leads/:id": ADMIN_SALES,
  "POST /api/leads/:id/messages": ADMIN_SALES,

  "GET /api/mail/outbox": ADMIN,
  "POST /api/mail/outbox/retry": ADMIN,
  "GET /api/mail/captured": ADMIN,
  "GET /api/mail/captured/:id": ADMIN,
  "GET /api/mail/captured/:id/html": ADMIN,

  "GET /api/feeds": FEEDS,
  "POST /api/feeds": FEEDS,
  "POST /api/feeds/preview": FEEDS,
  "GET /api/feeds/:id": FEEDS,
  "PATCH /api/feeds/:id": FEEDS,
  "POST /api/feeds/:id/rotate": FEEDS,
  "DELETE /api/feeds/:id": FEEDS,
  "GET /api/feeds/:id/download": FEEDS,

  // Public pages and files outside /api: anyone (the staff SPA's own guard sends the signed-out to /sign-in).
  "GET /media/{*key}": EVERYONE,
  "GET /vehicles/:slug": EVERYONE,
  "GET /vehicles/:slug/card": EVERYONE,
  "GET /vehicles/:slug/revisions/:n": EVERYONE,
  "GET /sitemap.xml": EVERYONE,
  "GET /favicon.ico": EVERYONE,
  "GET /robots.txt": EVERYONE,
  "GET /feeds/:file": EVERYONE,
  "GET /{*splat}": EVERYONE,
};

/** A caller the route admits, preferring the least privileged staff role, for requests that should get past the guard. */
export function callerFor(key: string): Caller {
  const allowed = ROUTE_POLICY[key];
  if (!allowed) throw new Error(`no policy for ${key}`);
  for (const c of ["public", "marketing", "workshop", "sales", "admin"] as const) if (allowed.includes(c)) return c;
  return allowed[0]!;
}
