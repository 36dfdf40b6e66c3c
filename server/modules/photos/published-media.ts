import { eq } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { revisionMedia } from "../../db/schema/index.ts";

/** Enough for every key of a few thousand published photos; past it the memory starts again (correct, only slower). */
const MAX_REMEMBERED = 50_000;

/**
 * Whether a stored key is shown by a published revision (revision_media), so portals may embed it. Revisions are
 * never updated or deleted, so a key once published stays published: those answers are remembered in memory and
 * hold on every instance. A "no" is never remembered, since another instance may publish the key a moment later;
 * it costs one indexed lookup, and only staff screens ask for media that is not published.
 */
export function publishedMedia(db: Db) {
  const known = new Set<string>();
  return async function isPublished(key: string): Promise<boolean> {
    if (known.has(key)) return true;
    const rows = await db.select({ key: revisionMedia.key }).from(revisionMedia).where(eq(revisionMedia.key, key)).limit(1);
    if (!rows.length) return false;
    if (known.size >= MAX_REMEMBERED) known.clear();
    known.add(key);
    return true;
  };
}
