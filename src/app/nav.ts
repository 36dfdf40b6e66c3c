import type { Role } from "../../shared/constants/roles.ts";
import { can, type Action } from "../../shared/permissions.ts";

export interface NavItem {
  to: string;
  label: string;
  /** The action the page is for; the item shows to whoever may take it (shared/permissions.ts). */
  action: Action;
  end?: boolean;
}

/** The staff navigation. The server enforces every permission; this only hides what a role cannot use. */
export const NAV: NavItem[] = [
  { to: "/app", label: "Overview", action: "staff.enter", end: true },
  { to: "/app/vehicles", label: "Stock", action: "vehicles.read" },
  { to: "/app/leads", label: "Enquiries", action: "leads.stats" },
  { to: "/app/feeds", label: "Feeds", action: "feeds.manage" },
  { to: "/app/users", label: "Staff", action: "users.manage" },
  { to: "/app/settings", label: "Dealership", action: "dealership.edit" },
  { to: "/app/mail", label: "Mail", action: "mail.read" },
];

export const navFor = (user: { role: Role }) => NAV.filter((item) => can(user, item.action));
