export const ROLES = ["admin", "sales", "workshop", "marketing"] as const;
export type Role = (typeof ROLES)[number];

/** What each role is for, in the staff screens' words. */
export const ROLE_LABELS: Record<Role, { label: string; summary: string }> = {
  admin: { label: "Admin", summary: "Users, settings and every vehicle; may override a publish block with a reason." },
  sales: { label: "Sales", summary: "Creates and edits vehicles, photos, copy and price; publishes; works enquiries." },
  workshop: { label: "Workshop", summary: "Records tyres, checks, defects and photos; cannot set price or publish." },
  marketing: { label: "Marketing", summary: "Reads all stock; manages feeds; edits listing copy only." },
};
