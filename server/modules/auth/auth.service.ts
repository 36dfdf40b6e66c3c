import { eq } from "drizzle-orm";
import type { AppContext } from "../../lib/context.ts";
import { users } from "../../db/schema/index.ts";
import { unauthorized } from "../../lib/errors.ts";
import { createHash } from "node:crypto";
import { countFailure, isBlocked, overBy, refusal } from "../../lib/rate-limit.ts";
import { timingSafeMiss, verifyPassword } from "./password.ts";

// Accounts made outside a request (the demo seed) hash their passwords the same way.
export { hashPassword } from "./password.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import type { SignInInput } from "../../../shared/schemas/auth.ts";

const WRONG = "That e-mail address and password do not match an active account.";

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** The account-and-address key: hashed, so the counters table holds no address next to an e-mail. */
const pairKey = (email: string, ip: string) => createHash("sha256").update(`${email}\n${ip}`).digest("hex");

/**
 * Signs a user in. Only failures count (rate-limiter-flexible's brute-force pattern): per address (any account),
 * per account-and-address pair (reset by a success) and per account (guessing from many addresses). An address that
 * has signed in to the account before is never refused by the pair or account counts, so a stranger's failures
 * elsewhere cannot lock its owner out: past those limits its attempts wait instead, longer as failures go on, and
 * the wait comes before the password is checked so a quick answer never tells a guess was right.
 */
export async function signIn(ctx: AppContext, input: SignInInput, ip: string) {
  const { db } = ctx.database;
  const limits = ctx.limiters;
  const pair = pairKey(input.email, ip);
  const [address, pairOver, accountOver, known] = await Promise.all([
    isBlocked(limits.signInPerAddress, ip),
    overBy(limits.signInPerPair, pair),
    overBy(limits.signInPerAccount, input.email),
    limits.signInKnown.get(pair).then((res) => res !== null),
  ]);
  if (address) throw refusal(address, "Too many failed sign-ins from your network.");
  if (pairOver || accountOver) {
    if (!known) {
      const spent = (pairOver ? await limits.signInPerPair.get(pair) : await limits.signInPerAccount.get(input.email))!;
      throw refusal(spent, "Too many failed sign-ins for this account. Ask an admin to reset the password if you have forgotten it.");
    }
    const { firstMs, maxMs } = limits.signInSlowdown;
    await sleep(Math.min(maxMs, firstMs * 2 ** (Math.max(pairOver, accountOver) - 1)));
  }
  const [user] = await db.select().from(users).where(eq(users.email, input.email)).limit(1);
  const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await timingSafeMiss(input.password), false);
  if (!user || !ok || !user.active) {
    await Promise.all([
      countFailure(limits.signInPerAddress, ip),
      countFailure(limits.signInPerPair, pair, !known),
      countFailure(limits.signInPerAccount, input.email),
    ]);
    throw unauthorized(WRONG);
  }
  // The account's count stays: a success does not undo guesses made elsewhere, and it never refuses this address.
  await Promise.all([limits.signInPerPair.delete(pair), limits.signInKnown.set(pair, 1, limits.signInKnown.duration)]);
  const session = await ctx.auth.createSession(user.id, {});
  await db.update(users).set({ lastSignInAt: ctx.now() }).where(eq(users.id, user.id));
  await recordAudit(db, actorOf(user), {
    action: "sign_in",
    entityType: "user",
    entityId: user.id,
  });
  return { session, user };
}
