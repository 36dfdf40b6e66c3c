import type { PhotoUpdateInput } from "../../../shared/schemas/evidence.ts";
import { and, eq, inArray, ne } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import type { Storage } from "../../lib/storage.ts";
import { defects, photos, type Photo } from "../../db/schema/index.ts";
import { AppError, conflict, notFound, staleVersion } from "../../lib/errors.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import { PHOTO_LIMITS } from "../../../shared/constants/evidence.ts";
import { lockVehicle, requireVehicle as vehicleOf } from "../vehicles/vehicles.service.ts";
import { makeCloseup, makeVariants, prepareMaster } from "./photo-pipeline.ts";
import { findPhoto, photoCount, photosOf } from "./photos.queries.ts";
import { presentPhoto, servedKeysOf, shownPublicly, type PhotoView, type Refusal } from "./photos.presenter.ts";

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

const requireVehicle = (ctx: AppContext, actor: User, vehicleId: number) => vehicleOf(ctx.database.db, actor.dealershipId, vehicleId);

/**
 * The front door for other modules: a vehicle's photos as presented, in order, and the storage keys of the files the
 * public may be shown (the served sizes of finished photos), both from the same rows, read with the caller's db or tx.
 */
export async function photoViewsOf(db: DbOrTx, vehicleId: number): Promise<{ views: PhotoView[]; publicKeys: string[] }> {
  const rows = await photosOf(db, vehicleId);
  return { views: rows.map(presentPhoto), publicKeys: rows.filter(shownPublicly).flatMap(servedKeysOf) };
}

/**
 * Makes a photo's served sizes now, on the caller's time instead of the worker's: the demo seed does this before it
 * publishes, since a revision shows finished photos only. The version stays: nobody has seen the photo yet.
 */
export async function makeSizesNow(db: DbOrTx, storage: Storage, p: Photo) {
  const variants = await makeVariants(storage, p.hash, await storage.read(p.masterKey), p.width);
  await db.update(photos).set({ variants, status: "ready" }).where(eq(photos.id, p.id));
}

// Image work the demo seed does itself: it draws its photos and pins its defects without an HTTP upload.
export { makeCloseup, prepareMaster };

/**
 * Cuts the close-up around a pin on one of the vehicle's photos, for the walk-around; null when the photo is not on
 * this vehicle.
 */
export async function closeupOn(storage: Storage, db: DbOrTx, vehicleId: number, pin: { photoId: number; x: number; y: number }) {
  const photo = await findPhoto(db, vehicleId, pin.photoId);
  if (!photo) return null;
  const closeupKey = await makeCloseup(storage, await storage.read(photo.masterKey), photo.width, photo.height, pin.x, pin.y);
  return { photoId: photo.id, closeupKey };
}

export async function list(ctx: AppContext, actor: User, vehicleId: number) {
  await requireVehicle(ctx, actor, vehicleId);
  return (await photosOf(ctx.database.db, vehicleId)).map(presentPhoto);
}

/**
 * Stores each file that sharp can decode and refuses the rest one by one, so a bad file never costs the good ones.
 * The master is written before its row; a row therefore never points at a missing file.
 */
export async function upload(ctx: AppContext, actor: User, vehicleId: number, files: UploadedFile[]) {
  await requireVehicle(ctx, actor, vehicleId);
  const accepted: PhotoView[] = [];
  const refused: Refusal[] = [];
  for (const file of files) {
    let master;
    try {
      master = await prepareMaster(file.buffer);
    } catch (err) {
      if (err instanceof AppError) {
        refused.push({ name: file.originalname, status: err.status, code: err.code, reason: err.message });
        continue;
      }
      throw err;
    }
    await ctx.storage.put(master.key, master.buffer);
    const row = await ctx.database.db.transaction(async (tx) => {
      // The vehicle row lock serialises uploads to one vehicle, so the count limit and positions hold.
      await lockVehicle(tx, actor.dealershipId, vehicleId);
      const { count, lastPosition } = await photoCount(tx, vehicleId);
      if (count >= PHOTO_LIMITS.maxPhotosPerVehicle) return null;
      const [res] = await tx.insert(photos).values({
        vehicleId,
        position: lastPosition + 1,
        isCover: count === 0,
        hash: master.hash,
        masterKey: master.key,
        width: master.width,
        height: master.height,
        placeholder: master.placeholder,
        variants: [],
        uploadedBy: actor.id,
      });
      await recordAudit(tx, actorOf(actor), { action: "photo_added", entityType: "vehicle", entityId: vehicleId, after: { photoId: res.insertId, name: file.originalname.slice(0, 120) } });
      return await findPhoto(tx, vehicleId, res.insertId);
    });
    if (!row) {
      refused.push({ name: file.originalname, status: 409, code: "too_many_photos", reason: `This vehicle already has ${PHOTO_LIMITS.maxPhotosPerVehicle} photos, the most allowed. Delete some first.` });
      continue;
    }
    accepted.push(presentPhoto(row));
  }
  if (accepted.length) ctx.photoWorker.kick();
  return { accepted, refused };
}

export type PhotoChanges = PhotoUpdateInput;

export async function update(ctx: AppContext, actor: User, vehicleId: number, photoId: number, input: PhotoChanges) {
  await requireVehicle(ctx, actor, vehicleId);
  return ctx.database.db.transaction(async (tx) => {
    const current = await findPhoto(tx, vehicleId, photoId, true);
    if (!current) throw notFound("That photo");
    if (current.version !== input.version) throw staleVersion(presentPhoto(current));
    if (input.isCover) await tx.update(photos).set({ isCover: false }).where(and(eq(photos.vehicleId, vehicleId), ne(photos.id, photoId)));
    const set = {
      ...(input.caption !== undefined ? { caption: input.caption } : {}),
      ...(input.zone !== undefined ? { zone: input.zone } : {}),
      ...(input.isCover ? { isCover: true } : {}),
    };
    await tx.update(photos).set({ ...set, version: current.version + 1 }).where(eq(photos.id, photoId));
    await recordAudit(tx, actorOf(actor), {
      action: "photo_updated",
      entityType: "vehicle",
      entityId: vehicleId,
      before: { photoId, caption: current.caption, zone: current.zone, isCover: current.isCover },
      after: { photoId, ...set },
    });
    return presentPhoto(await findPhoto(tx, vehicleId, photoId));
  });
}

export async function reorder(ctx: AppContext, actor: User, vehicleId: number, order: number[]) {
  await requireVehicle(ctx, actor, vehicleId);
  return ctx.database.db.transaction(async (tx) => {
    await lockVehicle(tx, actor.dealershipId, vehicleId);
    const current = await photosOf(tx, vehicleId);
    const ids = current.map((p) => p.id).sort((a, b) => a - b);
    if (JSON.stringify([...order].sort((a, b) => a - b)) !== JSON.stringify(ids)) {
      throw conflict("The photo list changed while you were reordering. Reload and try again.", { current: current.map(presentPhoto) }, "stale_order");
    }
    for (const [i, id] of order.entries()) await tx.update(photos).set({ position: i + 1 }).where(eq(photos.id, id));
    await recordAudit(tx, actorOf(actor), { action: "photos_reordered", entityType: "vehicle", entityId: vehicleId, before: { order: current.map((p) => p.id) }, after: { order } });
    return (await photosOf(tx, vehicleId)).map(presentPhoto);
  });
}

/** Deletes the row first; its files go with the next clean-up once nothing refers to them. Pins on it are cleared. */
export async function remove(ctx: AppContext, actor: User, vehicleId: number, photoId: number, version: number) {
  await requireVehicle(ctx, actor, vehicleId);
  await ctx.database.db.transaction(async (tx) => {
    const current = await findPhoto(tx, vehicleId, photoId, true);
    if (!current) throw notFound("That photo");
    if (current.version !== version) throw staleVersion(presentPhoto(current));
    await tx.update(defects).set({ photoId: null, pinX: null, pinY: null, closeupKey: null }).where(eq(defects.photoId, photoId));
    await tx.delete(photos).where(eq(photos.id, photoId));
    if (current.isCover) {
      const [next] = await photosOf(tx, vehicleId);
      if (next) await tx.update(photos).set({ isCover: true }).where(inArray(photos.id, [next.id]));
    }
    await recordAudit(tx, actorOf(actor), { action: "photo_deleted", entityType: "vehicle", entityId: vehicleId, before: { photoId, caption: current.caption }, after: null });
  });
}
