import type { User } from "lucia";

/** Plain predicates; handlers call them and fail closed. */
export const canManageUsers = (user: User) => user.role === "admin";
