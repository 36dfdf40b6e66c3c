import { isNotNull } from "drizzle-orm";
import type { Database } from "../../db/client.ts";
import { defects, photos, revisionMedia } from "../../db/schema/index.ts";
import { removeIfOlder, removeListed, returnIfNeeded, type Storage } from "../../lib/storage.ts";

/** Every stored key a row refers to (also used by `npm run restore` to check a restored site). */
export async function referencedKeys(database: Database): Promise<Set<string>> {
  const keys = new Set<string>();
  for (const p of await database.db.select({ masterKey: photos.masterKey, variants: photos.variants }).from(photos)) {
    keys.add(p.masterKey);
    for (const v of p.variants) keys.add(v.key);
  }
  for (const d of await database.db.select({ key: defects.closeupKey }).from(defects).where(isNotNull(defects.closeupKey))) keys.add(d.key!);
  // Published revisions keep their files for ever: what a buyer was shown must stay showable.
  for (const r of await database.db.select({ key: revisionMedia.key }).from(revisionMedia)) keys.add(r.key);
  return keys;
}

/**
 * Removes files no row refers to and unfinished writes, once they are older than the grace period (an upload in
 * flight writes its file a moment before its row). Returns what it removed.
 */
export async function removeOrphans(database: Database, storage: Storage, root: string, options: { graceMs?: number; now?: Date } = {}) {
  const grace = options.graceMs ?? 60 * 60 * 1000;
  const cutoff = (options.now ?? new Date()).getTime() - grace;
  // The files lock (shared with `npm run backup`, see scripts/backup.ts): a backup copying files after its snapshot
  // must not see a file removed that a row in that snapshot names. Held for the whole pass; when a backup holds it,
  // this pass is skipped (the next hourly one catches up).
  const conn = await database.pool.getConnection();
  let released = true;
  try {
    const [[lock]] = (await conn.query("SELECT GET_LOCK(CONCAT(DATABASE(), ':files'), 0) AS got")) as unknown as [[{ got: number | null }]];
    if (!lock?.got) return [];
    try {
      const before = await referencedKeys(database);
      const removed: string[] = [];
      const candidates: string[] = [];
      for await (const file of storage.list()) {
        if (file.modifiedAt.getTime() > cutoff) continue;
        if (file.partial) {
          // A file moved aside by a pass that died before it could put it back: if a row needs it, it goes back.
          if (await returnIfNeeded(root, file.key, before)) continue;
          await removeListed(root, file.key);
          removed.push(file.key);
        } else if (!before.has(file.key)) candidates.push(file.key);
      }
      if (!candidates.length) return removed;
      // Read the references again after listing: a row written meanwhile (an upload of bytes whose old copy was
      // orphaned) keeps its file. removeIfOlder() covers the last gap, a put() between this read and the removal.
      const after = await referencedKeys(database);
      for (const key of candidates) {
        if (after.has(key)) continue;
        if (await removeIfOlder(root, key, cutoff)) removed.push(key);
      }
      return removed;
    } finally {
      await conn.query("SELECT RELEASE_LOCK(CONCAT(DATABASE(), ':files'))").catch(() => {
        // A connection that could not release the lock must not go back to the pool still holding it (every later
        // pass and every backup would wait on it); closing it releases the lock.
        released = false;
      });
    }
  } finally {
    if (released) conn.release();
    else conn.destroy();
  }
}
