import { eq } from "drizzle-orm";
import type { AppContext } from "../../lib/context.ts";
import { users } from "../../db/schema/index.ts";
import { unauthorized } from "../../lib/errors.ts";
import { consume, isBlocked } from "../../lib/rate-limit.ts";
import { timingSafeMiss, verifyPassword } from "./password.ts";

// Accounts made outside a request (the demo seed) hash their passwords the same way.
export { hashPassword } from "./password.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import type { SignInInput } from "../../../shared/schemas/auth.ts";
import { tooMany } from "../../lib/errors.ts";

const WRONG = "That e-mail address and password do not match an active account.";

/**
 * Signs a user in. Limits: every attempt counts against the address; failed attempts count against the
 * account, so a guessing run against one account stops even when it comes from many addresses.
 */
export async function signIn(ctx: AppContext, input: SignInInput, ip: string) {
  const { db } = ctx.database;
  await consume(ctx.limiters.signInPerAddress, ip, "sign-in attempts from your network");
  const blocked = await isBlocked(ctx.limiters.signInPerAccount, input.email);
  if (blocked) {
    const minutes = Math.max(1, Math.ceil(blocked.msBeforeNext / 60_000));
    throw tooMany(
      `Too many failed sign-ins for this account. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again, or ask an admin to reset the password.`,
      Math.ceil(blocked.msBeforeNext / 1000),
    );
  }
  const [user] = await db.select().from(users).where(eq(users.email, input.email)).limit(1);
  const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await timingSafeMiss(input.password), false);
  if (!user || !ok || !user.active) {
    await ctx.limiters.signInPerAccount.penalty(input.email, 1).catch(() => undefined);
    throw unauthorized(WRONG);
  }
  await ctx.limiters.signInPerAccount.delete(input.email).catch(() => undefined);
  const session = await ctx.auth.createSession(user.id, {});
  await db.update(users).set({ lastSignInAt: ctx.now() }).where(eq(users.id, user.id));
  await recordAudit(db, actorOf(user), {
    action: "sign_in",
    entityType: "user",
    entityId: user.id,
  });
  return { session, user };
}
