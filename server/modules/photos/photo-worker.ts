import { eq, sql } from "drizzle-orm";
import type { Logger } from "pino";
import type { Database } from "../../db/client.ts";
import { photos } from "../../db/schema/index.ts";
import type { Storage } from "../../lib/storage.ts";
import { makeVariants } from "./photo-pipeline.ts";
import { processingPhotos } from "./photos.queries.ts";
import { BackgroundLoop } from "../../lib/background-loop.ts";

/**
 * Makes the served variants of uploaded photos, one at a time, off the request path. The queue is the photos
 * table itself (status "processing"), so work survives a crash and any instance can pick it up; a named lock per
 * photo keeps two instances from doing the same one.
 */
export class PhotoWorker extends BackgroundLoop {
  constructor(
    private readonly database: Database,
    private readonly storage: Storage,
    private readonly logger: Logger,
    pollMs = 5000,
  ) {
    super(pollMs);
  }

  protected async drain() {
    // Photos another instance holds are left to it for this pass.
    const skipped = new Set<number>();
    for (;;) {
      if (this.stopped) return;
      const batch = (await processingPhotos(this.database.db).catch(() => [])).filter((p) => !skipped.has(p.id));
      if (!batch.length) return;
      for (const { id } of batch) {
        if (this.stopped) return;
        const done = await this.processOne(id).catch((err) => {
          this.logger.error({ err, photoId: id }, "photo processing failed");
          return false;
        });
        if (!done) skipped.add(id);
      }
    }
  }

  /** True when this instance handled the photo (made its variants or marked it failed). */
  private async processOne(id: number): Promise<boolean> {
    const conn = await this.database.pool.getConnection();
    try {
      const [[lock]] = (await conn.query("SELECT GET_LOCK(CONCAT(DATABASE(), ':photo:', ?), 0) AS got", [id])) as unknown as [[{ got: number }]];
      if (!lock?.got) return false;
      const [row] = await this.database.db.select().from(photos).where(eq(photos.id, id));
      if (!row || row.status !== "processing") return true;
      try {
        const master = await this.storage.read(row.masterKey);
        const variants = await makeVariants(this.storage, row.hash, master, row.width);
        await this.database.db.update(photos).set({ variants, status: "ready", version: sql`${photos.version} + 1` }).where(eq(photos.id, id));
      } catch (err) {
        this.logger.error({ err, photoId: id }, "photo variants failed; marking failed");
        await this.database.db.update(photos).set({ status: "failed", version: sql`${photos.version} + 1` }).where(eq(photos.id, id));
      }
      return true;
    } finally {
      await conn.query("SELECT RELEASE_LOCK(CONCAT(DATABASE(), ':photo:', ?))", [id]).catch(() => undefined);
      conn.release();
    }
  }
}
