import type { Role } from "../../shared/constants/roles.ts";

export interface NavItem {
  to: string;
  label: string;
  roles: readonly Role[];
  end?: boolean;
}

const everyone = ["admin", "sales", "workshop", "marketing"] as const;

/** The staff navigation. The server enforces every permission; this only hides what a role cannot use. */
export const NAV: NavItem[] = [
  { to: "/app", label: "Overview", roles: everyone, end: true },
  { to: "/app/vehicles", label: "Stock", roles: everyone },
  { to: "/app/leads", label: "Enquiries", roles: ["admin", "sales", "marketing"] },
  { to: "/app/feeds", label: "Feeds", roles: ["admin", "marketing"] },
  { to: "/app/users", label: "Staff", roles: ["admin"] },
  { to: "/app/settings", label: "Dealership", roles: ["admin"] },
  { to: "/app/mail", label: "Mail", roles: ["admin"] },
];

export const navFor = (role: Role) => NAV.filter((item) => item.roles.includes(role));
