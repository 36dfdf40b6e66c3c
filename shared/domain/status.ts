// A vehicle's path through the yard (../shared/PRODUCT.md "A vehicle's path"): which moves exist, who may make
// them, and which happen only through another action. Pure: the server enforces it, the client shows it.
import type { Role } from "../constants/roles.ts";
import type { VehicleStatus } from "../constants/vehicle.ts";

export interface StatusMove {
  from: VehicleStatus;
  to: VehicleStatus;
  roles: readonly Role[];
  /** A plain label for the button. */
  label: string;
  /** Moves that only another action makes (publishing makes a vehicle live). */
  via?: "publish";
}

const SELLERS: readonly Role[] = ["admin", "sales"];
const PREP: readonly Role[] = ["admin", "sales", "workshop"];

export const STATUS_MOVES: readonly StatusMove[] = [
  { from: "intake", to: "preparing", roles: PREP, label: "Start preparing" },
  { from: "preparing", to: "intake", roles: SELLERS, label: "Back to intake" },
  { from: "preparing", to: "live", roles: SELLERS, label: "Publish", via: "publish" },
  { from: "withdrawn", to: "live", roles: SELLERS, label: "Publish again", via: "publish" },
  { from: "live", to: "reserved", roles: SELLERS, label: "Reserve for a buyer" },
  { from: "reserved", to: "live", roles: SELLERS, label: "Release the reservation" },
  { from: "live", to: "sold", roles: SELLERS, label: "Mark sold" },
  { from: "reserved", to: "sold", roles: SELLERS, label: "Mark sold" },
  { from: "sold", to: "reserved", roles: ["admin"], label: "Sale fell through" },
  { from: "live", to: "withdrawn", roles: SELLERS, label: "Withdraw from sale" },
  { from: "reserved", to: "withdrawn", roles: SELLERS, label: "Withdraw from sale" },
  { from: "withdrawn", to: "preparing", roles: SELLERS, label: "Back to preparing" },
  { from: "sold", to: "archived", roles: SELLERS, label: "Archive" },
  { from: "intake", to: "archived", roles: ["admin"], label: "Archive (not for sale)" },
  { from: "preparing", to: "archived", roles: ["admin"], label: "Archive (not for sale)" },
  { from: "withdrawn", to: "archived", roles: ["admin"], label: "Archive" },
];

export type MoveVerdict =
  | { ok: true; move: StatusMove }
  | { ok: false; reason: string; code: "no_such_move" | "role" | "via_publish" | "same_status" };

export function checkStatusMove(from: VehicleStatus, to: VehicleStatus, role: Role): MoveVerdict {
  if (from === to) return { ok: false, code: "same_status", reason: `The vehicle is already ${to}.` };
  const move = STATUS_MOVES.find((m) => m.from === from && m.to === to);
  if (!move) return { ok: false, code: "no_such_move", reason: `A vehicle cannot go from ${from} to ${to}.` };
  if (move.via === "publish") return { ok: false, code: "via_publish", reason: "A vehicle goes live by publishing it, which checks it is ready." };
  if (!move.roles.includes(role)) return { ok: false, code: "role", reason: `Your role cannot move a vehicle from ${from} to ${to}.` };
  return { ok: true, move };
}

/** The moves a role can make from a status, publishing included, for the vehicle screen's buttons. */
export const movesFrom = (from: VehicleStatus, role: Role) => STATUS_MOVES.filter((m) => m.from === from && m.roles.includes(role));

/** Statuses in which a vehicle is in stock (days in stock keep counting). */
export const IN_STOCK: readonly VehicleStatus[] = ["intake", "preparing", "live", "reserved", "withdrawn"];
