import { createHash, randomBytes } from "node:crypto";
import { and, eq, gt, isNull } from "drizzle-orm";
import { generateIdFromEntropySize, type User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import { authTokens, users } from "../../db/schema/index.ts";
import { AppError, badRequest } from "../../lib/errors.ts";
import { consume } from "../../lib/rate-limit.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import { getDealership } from "../dealerships/dealerships.service.ts";
import { enqueueMail } from "../mail/outbox.ts";
import { inviteMail, resetMail } from "../mail/templates.ts";
import { hashPassword, weakPasswordReason } from "./password.ts";
import { presentInvite, type InviteView } from "./auth.presenter.ts";
import { ROLE_LABELS, type Role } from "../../../shared/constants/roles.ts";

const INVITE_MS = 7 * 24 * 3600 * 1000;
const RESET_MS = 60 * 60 * 1000;

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");
/** 256 bits, URL-safe; only its hash is stored, so a database copy cannot be used to take over an account. */
const newToken = () => randomBytes(32).toString("base64url");

const invalid = () => new AppError(400, "invalid_token", "This link is not valid any more: it was used already or has expired. Ask for a new one.");

export async function invite(ctx: AppContext, actor: User, input: { email: string; name: string; role: Role }) {
  const { db } = ctx.database;
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
  if (existing) throw badRequest("That e-mail address already has an account.", { email: "That e-mail address already has an account." });
  const d = await getDealership(db, actor.dealershipId);
  const token = newToken();
  await db.transaction(async (tx) => {
    await tx.insert(authTokens).values({ kind: "invite", tokenHash: sha256(token), dealershipId: d.id, email: input.email, name: input.name, role: input.role, expiresAt: new Date(ctx.now().getTime() + INVITE_MS), createdBy: actor.id });
    const url = `${ctx.config.publicUrl}/accept-invite?token=${token}`;
    await enqueueMail(tx, { to: input.email, kind: "invite", ...inviteMail(d, { name: input.name, role: ROLE_LABELS[input.role].label.toLowerCase(), url, invitedBy: actor.name }) }, ctx.now());
    await recordAudit(tx, actorOf(actor), { action: "user_invited", entityType: "user", entityId: input.email, after: { email: input.email, name: input.name, role: input.role } });
  });
  ctx.mail.kick();
  return { invited: input.email };
}

async function liveToken(ctx: AppContext, kind: "invite" | "reset", token: string) {
  const [row] = await ctx.database.db
    .select()
    .from(authTokens)
    .where(and(eq(authTokens.tokenHash, sha256(token)), eq(authTokens.kind, kind), isNull(authTokens.usedAt), gt(authTokens.expiresAt, ctx.now())));
  return row ?? null;
}

export async function inspectInvite(ctx: AppContext, token: string): Promise<InviteView> {
  const row = await liveToken(ctx, "invite", token);
  if (!row) throw invalid();
  return presentInvite(row);
}

/** The invitee sets their own password; the account is created and signed in. The token works once. */
export async function acceptInvite(ctx: AppContext, token: string, password: string) {
  const reason = weakPasswordReason(password);
  if (reason) throw badRequest("Choose a stronger password.", { password: reason });
  const passwordHash = await hashPassword(password);
  const userId = await ctx.database.db.transaction(async (tx) => {
    const [row] = await tx.select().from(authTokens).where(and(eq(authTokens.tokenHash, sha256(token)), eq(authTokens.kind, "invite"))).for("update");
    if (!row || row.usedAt || row.expiresAt <= ctx.now()) throw invalid();
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, row.email));
    if (taken) throw invalid();
    const id = generateIdFromEntropySize(10);
    await tx.insert(users).values({ id, dealershipId: row.dealershipId, email: row.email, name: row.name || row.email, role: row.role!, passwordHash });
    await tx.update(authTokens).set({ usedAt: ctx.now(), userId: id }).where(eq(authTokens.id, row.id));
    await recordAudit(tx, { id, email: row.email, dealershipId: row.dealershipId }, { action: "invite_accepted", entityType: "user", entityId: id });
    return id;
  });
  return ctx.auth.createSession(userId, {});
}

const SAME_ANSWER = { message: "If that address has an account, a link to reset the password is on its way. It works once, within an hour." };

/** The same answer whether or not the address exists; rate limited per address and per account. */
export async function requestReset(ctx: AppContext, email: string, ip: string) {
  await consume(ctx.limiters.resetPerAddress, ip, "password reset requests from your network");
  await consume(ctx.limiters.resetPerAccount, email, "password reset requests for this address");
  const { db } = ctx.database;
  const [user] = await db.select().from(users).where(and(eq(users.email, email), eq(users.active, true)));
  if (!user) return SAME_ANSWER;
  const d = await getDealership(db, user.dealershipId);
  const token = newToken();
  await db.transaction(async (tx) => {
    await tx.insert(authTokens).values({ kind: "reset", tokenHash: sha256(token), dealershipId: d.id, email, name: user.name, userId: user.id, expiresAt: new Date(ctx.now().getTime() + RESET_MS) });
    await enqueueMail(tx, { to: email, kind: "reset", ...resetMail(d, { name: user.name, url: `${ctx.config.publicUrl}/reset-password?token=${token}` }) }, ctx.now());
  });
  ctx.mail.kick();
  return SAME_ANSWER;
}

/** Sets the new password, uses the token up, and ends every session of the account. */
export async function confirmReset(ctx: AppContext, token: string, password: string) {
  const passwordHash = await hashPassword(password);
  const userId = await ctx.database.db.transaction(async (tx) => {
    const [row] = await tx.select().from(authTokens).where(and(eq(authTokens.tokenHash, sha256(token)), eq(authTokens.kind, "reset"))).for("update");
    if (!row || row.usedAt || row.expiresAt <= ctx.now() || !row.userId) throw invalid();
    const reason = weakPasswordReason(password, row.email);
    if (reason) throw badRequest("Choose a stronger password.", { password: reason });
    await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
    await tx.update(authTokens).set({ usedAt: ctx.now() }).where(eq(authTokens.id, row.id));
    await recordAudit(tx, { id: row.userId, email: row.email, dealershipId: row.dealershipId }, { action: "password_reset", entityType: "user", entityId: row.userId });
    return row.userId;
  });
  await ctx.auth.invalidateUserSessions(userId);
  return { reset: true };
}
