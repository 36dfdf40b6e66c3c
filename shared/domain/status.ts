// A vehicle's path through the yard (../shared/PRODUCT.md "A vehicle's path"): which moves exist, the action of
// shared/permissions.ts each needs, and which happen only through another action. Pure: the server enforces it, the
// client shows it.
import type { Role } from "../constants/roles.ts";
import type { VehicleStatus } from "../constants/vehicle.ts";
import { can, type Action } from "../permissions.ts";

export interface StatusMove {
  from: VehicleStatus;
  to: VehicleStatus;
  /** Who may make the move: the roles the permissions table gives this action. */
  allow: Action;
  /** A plain label for the button. */
  label: string;
  /** Moves that only another action makes (publishing makes a vehicle live). */
  via?: "publish";
}

export const STATUS_MOVES: readonly StatusMove[] = [
  { from: "intake", to: "preparing", allow: "status.prepare", label: "Start preparing" },
  { from: "preparing", to: "intake", allow: "status.send-back", label: "Back to intake" },
  { from: "preparing", to: "live", allow: "vehicle.publish", label: "Publish", via: "publish" },
  { from: "withdrawn", to: "live", allow: "vehicle.publish", label: "Publish again", via: "publish" },
  { from: "live", to: "reserved", allow: "status.sell", label: "Reserve for a buyer" },
  { from: "reserved", to: "live", allow: "status.sell", label: "Release the reservation" },
  { from: "live", to: "sold", allow: "status.sell", label: "Mark sold" },
  { from: "reserved", to: "sold", allow: "status.sell", label: "Mark sold" },
  { from: "sold", to: "reserved", allow: "status.undo-sale", label: "Sale fell through" },
  { from: "live", to: "withdrawn", allow: "status.sell", label: "Withdraw from sale" },
  { from: "reserved", to: "withdrawn", allow: "status.sell", label: "Withdraw from sale" },
  { from: "withdrawn", to: "preparing", allow: "status.send-back", label: "Back to preparing" },
  { from: "sold", to: "archived", allow: "status.sell", label: "Archive" },
  { from: "intake", to: "archived", allow: "status.archive-unsold", label: "Archive (not for sale)" },
  { from: "preparing", to: "archived", allow: "status.archive-unsold", label: "Archive (not for sale)" },
  { from: "withdrawn", to: "archived", allow: "status.archive-unsold", label: "Archive" },
];

export type MoveVerdict =
  | { ok: true; move: StatusMove }
  | { ok: false; reason: string; code: "no_such_move" | "role" | "via_publish" | "same_status" };

export function checkStatusMove(from: VehicleStatus, to: VehicleStatus, role: Role): MoveVerdict {
  if (from === to) return { ok: false, code: "same_status", reason: `The vehicle is already ${to}.` };
  const move = STATUS_MOVES.find((m) => m.from === from && m.to === to);
  if (!move) return { ok: false, code: "no_such_move", reason: `A vehicle cannot go from ${from} to ${to}.` };
  if (move.via === "publish") return { ok: false, code: "via_publish", reason: "A vehicle goes live by publishing it, which checks it is ready." };
  if (!can(role, move.allow)) return { ok: false, code: "role", reason: `Your role cannot move a vehicle from ${from} to ${to}.` };
  return { ok: true, move };
}

/** The moves a role can make from a status, publishing included, for the vehicle screen's buttons. */
export const movesFrom = (from: VehicleStatus, role: Role) => STATUS_MOVES.filter((m) => m.from === from && can(role, m.allow));
