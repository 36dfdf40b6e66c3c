import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { Role } from "../../../shared/constants/roles.ts";

/** The signed-in user as the client's session holds it: who, and in which role. */
export function presentSessionUser(user: { id: string; email: string; name: string; role: SessionUser["role"] }): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/** GET /api/auth/invitations/:token (inside `{ invitation }`): what the invitee is about to accept. */
export const presentInvite = (row: { email: string; name: string; role: Role | null }) => ({ email: row.email, name: row.name, role: row.role });
export type InviteView = ReturnType<typeof presentInvite>;
