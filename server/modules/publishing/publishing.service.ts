import { eq } from "drizzle-orm";
import { can } from "../../../shared/permissions.ts";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import { revisionMedia, revisions, vehicleEvents, vehicles, type Dealership, type Vehicle } from "../../db/schema/index.ts";
import { AppError, conflict, forbidden, staleVersion } from "../../lib/errors.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import { getDealership, todayFor } from "../dealerships/dealerships.service.ts";
import { evidenceOf, evidenceWithMediaOf } from "../condition/condition.service.ts";
import type { Evidence } from "../condition/condition.presenter.ts";
import { deriveFor, lockVehicle, recordView, requireVehicle } from "../vehicles/vehicles.service.ts";
import type { DealershipDay } from "../../lib/clock.ts";
import { readiness, type Readiness } from "../../../shared/domain/readiness.ts";
import { isDefectCaution, unrepairedSafetyDefects } from "../../../shared/domain/cautions.ts";
import { validateVinStructure, vinCheck } from "../../../shared/domain/vin.ts";
import { ROAD_POSITIONS } from "../../../shared/domain/tyre-assessment.ts";
import { describeChanges } from "../../../shared/domain/revision-changes.ts";
import type { VehicleStatus } from "../../../shared/constants/vehicle.ts";
import { buildSnapshot } from "./snapshot.ts";
import { latestRevision, revisionsOf } from "./publishing.queries.ts";
import { presentPublishing, presentPublishResult, presentVehicleDetail, type VehicleDetail } from "./publishing.presenter.ts";

const PUBLISHABLE_FROM: readonly VehicleStatus[] = ["preparing", "live", "reserved", "withdrawn"];

export function readinessOf(v: Vehicle, d: Dealership, evidence: Evidence): Readiness {
  const check = v.vin ? vinCheck(v.vin, { checkDigitMandatory: d.vinCheckDigitMandatory }) : null;
  return readiness({
    vin: { present: Boolean(v.vin), structurallyValid: v.vin ? validateVinStructure(v.vin).length === 0 : false, checkDigitBlocking: check?.blocking ?? false },
    priceCents: v.priceCents,
    description: v.description,
    photos: { count: evidence.photos.length, processing: evidence.photos.filter((p) => p.status !== "ready").length, hasCover: evidence.photos.some((p) => p.isCover) },
    minPhotos: d.minPhotos,
    zones: evidence.zones,
    roadTyresMeasured: ROAD_POSITIONS.filter((p) => evidence.tyres.readings.some((r) => r.reading.position === p && r.assessment.tread)).length,
    // Defects that affect safety have a readiness item of their own, so they are not listed twice.
    blockingCautions: evidence.cautions.filter((c) => c.level === "block" && !isDefectCaution(c)),
    unrepairedSafetyDefects: unrepairedSafetyDefects(evidence.defects).map((x) => x.number),
  });
}

const slugify = (s: string) =>
  s
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 100);

export const slugFor = (v: Pick<Vehicle, "buildYear" | "make" | "model" | "stockNumber">) => slugify([v.buildYear, v.make, v.model, v.stockNumber].filter(Boolean).join(" "));

export interface PublishInput {
  version?: number;
  overrideReason?: string;
}

/**
 * Publishes the vehicle as it stands: one immutable revision written in one transaction, under the vehicle's row
 * lock, so concurrent publishes queue up and each gets the next number. Not ready → 409 with the list; an admin may
 * override with a written reason, which is recorded on the revision and in the audit log.
 */
export async function publish(ctx: AppContext, actor: User, vehicleId: number, input: PublishInput) {
  return ctx.database.db.transaction(async (tx) => {
    const v = await lockVehicle(tx, actor.dealershipId, vehicleId);
    if (input.version !== undefined && input.version !== v.version) throw staleVersion({ version: v.version, status: v.status });
    if (!PUBLISHABLE_FROM.includes(v.status)) {
      throw conflict(`A vehicle that is ${v.status} cannot be published. ${v.status === "intake" ? "Start preparing it first." : ""}`.trim(), { status: v.status }, "illegal_move");
    }
    const d = await getDealership(tx, actor.dealershipId);
    const { evidence, mediaKeys } = await evidenceWithMediaOf(tx, d, v);
    const ready = readinessOf(v, d, evidence);
    let overrideReason: string | null = null;
    if (!ready.ready) {
      if (!input.overrideReason) {
        throw new AppError(409, "not_ready", `Not ready to publish: ${ready.missing.map((m) => m.label.toLowerCase()).join("; ")}.`, undefined, { readiness: ready });
      }
      if (!can(actor, "publish.override")) throw forbidden("Only an admin may publish a vehicle that is not ready.");
      // Photos still processing have no served sizes yet; a revision must never point at files still being made.
      if (ready.missing.some((m) => m.code === "photos_processing")) {
        throw new AppError(409, "not_ready", "Photos are still being prepared; wait a minute and publish again.", undefined, { readiness: ready });
      }
      overrideReason = input.overrideReason;
    }
    const derived = deriveFor(v, d, todayFor(ctx, d));
    const snapshot = buildSnapshot(v, derived, evidence, d);
    const previous = await latestRevision(tx, v.id);
    const changes = describeChanges(previous?.snapshot ?? null, snapshot, d.locale);
    const number = v.lastRevisionNumber + 1;
    const slug = v.publicSlug ?? slugFor(v);
    const now = ctx.now();
    const [res] = await tx.insert(revisions).values({
      vehicleId: v.id, number, slug, snapshot, changes, publishedAt: now, publishedBy: actor.id, publishedByName: actor.name, overrideReason,
      title: snapshot.title, make: v.make, model: v.model, bodyType: v.bodyType, fuelType: v.fuelType, priceCents: v.priceCents,
      odometerKm: v.odometerKmIndex, buildYear: v.buildYear, conditionIndex: snapshot.condition.index,
    });
    if (mediaKeys.length) await tx.insert(revisionMedia).values(mediaKeys.map((key) => ({ revisionId: res.insertId, key })));
    const goesLive = v.status === "preparing" || v.status === "withdrawn";
    await tx
      .update(vehicles)
      .set({ publicSlug: slug, currentRevisionId: res.insertId, lastRevisionNumber: number, version: v.version + 1, ...(goesLive ? { status: "live" as const } : {}) })
      .where(eq(vehicles.id, v.id));
    if (goesLive) {
      await tx.insert(vehicleEvents).values({ vehicleId: v.id, fromStatus: v.status, toStatus: "live", note: overrideReason ? `Published over a block: ${overrideReason}` : `Published revision ${number}`, userId: actor.id, userName: actor.name });
    }
    await recordAudit(tx, actorOf(actor), {
      action: overrideReason ? "published_with_override" : "published",
      entityType: "vehicle",
      entityId: v.id,
      after: { revision: number, slug, changes, ...(overrideReason ? { overrideReason, missing: ready.missing.map((m) => m.code) } : {}) },
    });
    return presentPublishResult({ number, publishedAt: now, changes, overrideReason }, slug, ctx.config.publicUrl);
  });
}

/**
 * GET /api/vehicles/:id: the record, its readiness and its publishing (revisions), for the page's header and side
 * panel; the evidence itself is GET /api/vehicles/:id/evidence (condition module). Composed here because publishing
 * already depends on vehicles and condition, so neither calls back up. Readiness reads every evidence table, as the
 * publish does, so the two never disagree; the reads run side by side, and before a first publish there are no
 * revisions to read.
 */
export async function vehicleDetail(ctx: AppContext, actor: User, id: number, day: () => Promise<DealershipDay>): Promise<VehicleDetail> {
  const { db } = ctx.database;
  const [v, { dealership: d }] = await Promise.all([requireVehicle(db, actor.dealershipId, id), day()]);
  const [evidence, published] = await Promise.all([evidenceOf(db, d, v), v.lastRevisionNumber ? revisionsOf(db, v.id) : []]);
  return presentVehicleDetail(recordView(ctx, v, d), presentPublishing(v, readinessOf(v, d, evidence), published, ctx.config.publicUrl));
}
