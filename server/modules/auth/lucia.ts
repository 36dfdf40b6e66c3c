import { Lucia, TimeSpan } from "lucia";
import { DrizzleMySQLAdapter } from "@lucia-auth/adapter-drizzle";
import type { Db } from "../../db/client.ts";
import { sessions, users } from "../../db/schema/index.ts";
import type { Role } from "../../../shared/constants/roles.ts";

export const SESSION_COOKIE = "forthright_session";

export function createAuth(db: Db, options: { secure: boolean; sessionDays: number }) {
  const adapter = new DrizzleMySQLAdapter(db, sessions, users);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(options.sessionDays, "d"),
    sessionCookie: { name: SESSION_COOKIE, expires: true, attributes: { secure: options.secure, sameSite: "lax" } },
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      name: attributes.name,
      role: attributes.role,
      active: attributes.active,
      dealershipId: attributes.dealershipId,
    }),
  });
}

export type Auth = ReturnType<typeof createAuth>;

declare module "lucia" {
  interface Register {
    Lucia: Auth;
    DatabaseUserAttributes: { email: string; name: string; role: Role; active: boolean; dealershipId: number };
  }
}
