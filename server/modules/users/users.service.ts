import { eq } from "drizzle-orm";
import { generateIdFromEntropySize } from "lucia";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import { users } from "../../db/schema/index.ts";
import { badRequest, conflict, notFound, staleVersion } from "../../lib/errors.ts";
import { hashPassword, weakPasswordReason } from "../auth/password.ts";
import { actorOf, diffFields, recordAudit } from "../audit/audit.service.ts";
import type { CreateUserInput, UpdateUserInput } from "../../../shared/schemas/users.ts";
import { countActiveAdmins, findUser, listUsers } from "./users.queries.ts";
import { presentUser } from "./users.presenter.ts";

function checkPassword(password: string, email: string) {
  const reason = weakPasswordReason(password, email);
  if (reason) throw badRequest("Choose a stronger password.", { password: reason });
}

export async function list(ctx: AppContext, actor: User) {
  return (await listUsers(ctx.database.db, actor.dealershipId)).map(presentUser);
}

export async function create(ctx: AppContext, actor: User, input: CreateUserInput) {
  checkPassword(input.password, input.email);
  const id = generateIdFromEntropySize(10);
  const passwordHash = await hashPassword(input.password);
  const { db } = ctx.database;
  const existing = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1);
  if (existing.length) throw badRequest("That e-mail address already has an account.", { email: "That e-mail address already has an account." });
  return db.transaction(async (tx) => {
    await tx.insert(users).values({ id, dealershipId: actor.dealershipId, email: input.email, name: input.name, role: input.role, passwordHash });
    await recordAudit(tx, actorOf(actor), {
      action: "user_created",
      entityType: "user",
      entityId: id,
      after: { email: input.email, name: input.name, role: input.role },
    });
    return presentUser(await findUser(tx, actor.dealershipId, id));
  });
}

export async function update(ctx: AppContext, actor: User, id: string, input: UpdateUserInput) {
  const { db } = ctx.database;
  const passwordHash = input.password ? await hashPassword(input.password) : undefined;
  const result = await db.transaction(async (tx) => {
    const current = await findUser(tx, actor.dealershipId, id, true);
    if (!current) throw notFound("That user");
    if (current.version !== input.version) throw staleVersion(presentUser(current));
    if (input.password) checkPassword(input.password, current.email);
    const losingAdmin =
      current.role === "admin" && current.active && (input.active === false || (input.role && input.role !== "admin"));
    if (losingAdmin && (await countActiveAdmins(tx, actor.dealershipId)) <= 1) {
      throw conflict("This is the only active admin. Make someone else an admin first.", undefined, "last_admin");
    }
    if (id === actor.id && input.active === false) throw conflict("You cannot deactivate your own account.", undefined, "self_deactivate");
    const changes = { name: input.name, role: input.role, active: input.active };
    const set = Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined));
    await tx
      .update(users)
      .set({ ...set, ...(passwordHash ? { passwordHash } : {}), version: current.version + 1 })
      .where(eq(users.id, id));
    const diff = diffFields({ name: current.name, role: current.role, active: current.active }, set);
    await recordAudit(tx, actorOf(actor), {
      action: "user_updated",
      entityType: "user",
      entityId: id,
      before: diff?.before ?? null,
      after: { ...(diff?.after ?? {}), ...(passwordHash ? { password: "changed" } : {}) },
    });
    const updated = await findUser(tx, actor.dealershipId, id);
    return { updated, revoke: input.active === false || Boolean(passwordHash) };
  });
  // Deactivation or a new password ends the user's sessions at once. A role change needs no revocation:
  // every request reads the user's role afresh from the database.
  if (result.revoke) await ctx.auth.invalidateUserSessions(id);
  return presentUser(result.updated);
}
