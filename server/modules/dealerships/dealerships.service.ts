import { eq } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import { dealerships, type Dealership } from "../../db/schema/index.ts";
import { notFound, staleVersion } from "../../lib/errors.ts";
import { dayIn } from "../../lib/clock.ts";
import { actorOf, diffFields, recordAudit } from "../audit/audit.service.ts";
import type { DealershipSettingsInput } from "../../../shared/schemas/dealership.ts";
import { presentDealership } from "./dealerships.presenter.ts";

/** The dealership's calendar day now: the clock every derived figure is computed against. */
export const todayFor = (ctx: AppContext, d: Pick<Dealership, "timeZone">) => dayIn(d.timeZone, ctx.now());

export async function getDealership(db: DbOrTx, id: number, forUpdate = false): Promise<Dealership> {
  const q = db.select().from(dealerships).where(eq(dealerships.id, id)).limit(1);
  const [row] = forUpdate ? await q.for("update") : await q;
  if (!row) throw notFound("The dealership");
  return row;
}

/** The single dealership this installation serves (the first one created). */
export async function primaryDealership(db: DbOrTx): Promise<Dealership | null> {
  const [row] = await db.select().from(dealerships).orderBy(dealerships.id).limit(1);
  return row ?? null;
}

export async function updateSettings(ctx: AppContext, actor: User, input: DealershipSettingsInput) {
  return ctx.database.db.transaction(async (tx) => {
    const current = await getDealership(tx, actor.dealershipId, true);
    if (current.version !== input.version) throw staleVersion(presentDealership(current));
    const { version, ...changes } = input;
    await tx.update(dealerships).set({ ...changes, version: version + 1 }).where(eq(dealerships.id, current.id));
    const diff = diffFields(current as unknown as Record<string, unknown>, changes);
    await recordAudit(tx, actorOf(actor), {
      action: "settings_updated",
      entityType: "dealership",
      entityId: current.id,
      before: diff?.before ?? null,
      after: diff?.after ?? null,
    });
    return presentDealership(await getDealership(tx, current.id));
  });
}
