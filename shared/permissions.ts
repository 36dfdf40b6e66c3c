/**
 * Who may do what: the one table of actions → roles (../shared/PRODUCT.md, "Roles"). The server's guard takes an
 * action name (`allow("vehicle.publish")` in server/lib/route.ts), the client asks `can(user, action)` before it shows
 * a control, the staff navigation reads it, and the route × role matrix test is built from it. No role name is
 * compared anywhere else: a new rule is a new line here.
 *
 * admin has everything; sales works vehicles, evidence, publishing and enquiries; workshop records evidence but cannot
 * price, publish or work leads; marketing reads stock, edits listing copy, manages feeds and sees lead counts only.
 */
import { ROLES, type Role } from "./constants/roles.ts";

const STAFF = ROLES;
const ADMIN = ["admin"] as const satisfies readonly Role[];
const SELLERS = ["admin", "sales"] as const satisfies readonly Role[];
const WORKSHOP = ["admin", "sales", "workshop"] as const satisfies readonly Role[];
const MARKETING = ["admin", "marketing"] as const satisfies readonly Role[];

export const PERMISSIONS = {
  /** Signed in as any staff role: the staff frame, the stock list and every vehicle's record. */
  "staff.enter": STAFF,
  "vehicles.read": STAFF,
  "vehicle.create": SELLERS,
  /** Save the vehicle at all; which fields each role may change is the field catalogue's `vehicle.*.edit` actions. */
  "vehicle.edit": STAFF,
  "vehicle.identity.edit": SELLERS,
  "vehicle.specification.edit": WORKSHOP,
  "vehicle.economy.edit": WORKSHOP,
  "vehicle.history.edit": WORKSHOP,
  "vehicle.listing.edit": ["admin", "sales", "marketing"],
  "vehicle.price.edit": SELLERS,
  /** Status moves: start preparing (intake → preparing) and the sale's moves; shared/domain/status.ts names one per move. */
  "vehicle.status.move": WORKSHOP,
  "status.prepare": WORKSHOP,
  /** Send a vehicle back a stage (preparing → intake, withdrawn → preparing): the workshop only moves work forward. */
  "status.send-back": SELLERS,
  "status.sell": SELLERS,
  "status.undo-sale": ADMIN,
  "status.archive-unsold": ADMIN,
  /** Photos, walk-around zones and defects, tyres and checks. */
  "evidence.write": WORKSHOP,
  "vehicle.publish": SELLERS,
  /** Publish over a readiness block, with a recorded reason. */
  "publish.override": ADMIN,
  "vehicle.share": SELLERS,
  "leads.read": SELLERS,
  "leads.work": SELLERS,
  /** Reassign an enquiry to another salesperson. */
  "leads.assign": ADMIN,
  /** Counts of enquiries, without the buyers' details. */
  "leads.stats": ["admin", "sales", "marketing"],
  "feeds.manage": MARKETING,
  "users.manage": ADMIN,
  "dealership.read": STAFF,
  "dealership.edit": ADMIN,
  /** The outbox, and in demo mode the mail the local catcher received. */
  "mail.read": ADMIN,
  /** Send the outbox's waiting mail now rather than at its next attempt. */
  "mail.retry": ADMIN,
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;

export const ACTIONS = Object.keys(PERMISSIONS) as Action[];

/** The roles that may take an action. */
export const rolesFor = (action: Action): readonly Role[] => PERMISSIONS[action];

/** Whether a user (or a bare role) may take an action. Nobody signed in may take none. */
export function can(who: { role: Role } | Role | null | undefined, action: Action): boolean {
  if (!who) return false;
  const role = typeof who === "string" ? who : who.role;
  return (PERMISSIONS[action] as readonly Role[]).includes(role);
}

/** The roles a user may be given, for the staff screen's role picker: also the list of roles that exist. */
export { ROLES };
