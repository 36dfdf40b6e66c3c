import type { Vehicle } from "../../db/schema/index.ts";
import type { Readiness } from "../../../shared/domain/readiness.ts";
import type { VehicleRecord } from "../vehicles/vehicles.presenter.ts";

export const publicUrlOf = (publicUrl: string, slug: string) => `${publicUrl}/vehicles/${slug}`;

/** The staff view of a vehicle's publishing: readiness now, and every revision with who published it. */
export function presentPublishing(
  v: Pick<Vehicle, "publicSlug">,
  readiness: Readiness,
  revisions: Array<{ number: number; publishedAt: Date; publishedByName: string | null; overrideReason: string | null; changes: string[] }>,
  publicUrl: string,
) {
  return {
    readiness,
    slug: v.publicSlug,
    url: v.publicSlug ? publicUrlOf(publicUrl, v.publicSlug) : null,
    revisions: revisions.map((r) => ({ ...r, publishedAt: r.publishedAt.toISOString() })),
  };
}
export type PublishingView = ReturnType<typeof presentPublishing>;

/** POST /api/vehicles/:id/publish (201): the revision just written and where buyers read it. */
export function presentPublishResult(
  revision: { number: number; publishedAt: Date; changes: string[]; overrideReason: string | null },
  slug: string,
  publicUrl: string,
) {
  return {
    revision: { number: revision.number, publishedAt: revision.publishedAt.toISOString(), changes: revision.changes, overrideReason: revision.overrideReason },
    slug,
    url: publicUrlOf(publicUrl, slug),
  };
}
export type PublishResult = ReturnType<typeof presentPublishResult>;

/**
 * GET /api/vehicles/:id (inside `{ vehicle }`): the record with its readiness and publishing, what the page's header
 * and side panel show. The evidence is its own answer (condition.presenter.ts, GET /api/vehicles/:id/evidence), so a
 * field save and an evidence save each re-read only their own part.
 */
export const presentVehicleDetail = (record: VehicleRecord, publishing: PublishingView) => ({
  ...record,
  readiness: publishing.readiness,
  publishing,
});
export type VehicleDetail = ReturnType<typeof presentVehicleDetail>;
