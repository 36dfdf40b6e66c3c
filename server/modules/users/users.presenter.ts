import type { User as DbUser } from "../../db/schema/index.ts";
import type { UserView } from "../../../shared/schemas/users.ts";

/** The fields of a user that leave the server; never the password hash. */
export function presentUser(user: DbUser): UserView {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
    createdAt: user.createdAt.toISOString(),
    version: user.version,
  };
}

