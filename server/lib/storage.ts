import { createReadStream } from "node:fs";
import { mkdir, open, readdir, readFile, rename, rm, stat } from "node:fs/promises";
import { randomBytes } from "node:crypto";
import path from "node:path";
import type { Readable } from "node:stream";

/**
 * Where uploaded files live. Keys are server-generated ("photos/ab/<sha256>-640.webp"), never user-supplied paths.
 * The local folder is the default; an S3-compatible store can implement the same interface for several instances.
 */
export interface Storage {
  put(key: string, data: Buffer): Promise<void>;
  read(key: string): Promise<Buffer>;
  stream(key: string): Readable;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
  /** Every stored key with its age, for the orphan clean-up. Unfinished writes are listed with `partial`. */
  list(): AsyncIterable<{ key: string; modifiedAt: Date; partial: boolean }>;
}

export const KEY_PATTERN = /^(photos|closeups)\/[a-f0-9]{2}\/[a-f0-9]{64}(-[a-z0-9]+)?\.(jpg|webp|avif)$/;

export function assertKey(key: string): void {
  if (!KEY_PATTERN.test(key)) throw new Error(`refusing an unexpected storage key: ${key}`);
}

async function syncDirectory(dir: string) {
  const handle = await open(dir, "r");
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}

export function localStorage(root: string): Storage {
  const dir = path.resolve(root);
  const full = (key: string) => {
    assertKey(key);
    return path.join(dir, key);
  };
  return {
    async put(key, data) {
      const target = full(key);
      const created = await mkdir(path.dirname(target), { recursive: true });
      // Write beside, then rename: a crash leaves a .partial file (cleaned up later), never a half file under the key.
      const tmp = `${target}.${randomBytes(6).toString("hex")}.partial`;
      const file = await open(tmp, "wx");
      try {
        await file.writeFile(data);
        // On disk before the rename, and the rename on disk before put() returns: the row written next (whose commit
        // MariaDB flushes) must never outlive its file in a power cut or kernel crash.
        await file.sync();
      } finally {
        await file.close();
      }
      await rename(tmp, target);
      for (let d = path.dirname(target); ; d = path.dirname(d)) {
        await syncDirectory(d);
        // New shard folders: their own entries must be durable too, up to the first folder that already existed.
        if (!created || d === path.dirname(created) || d === dir || d === path.dirname(d)) break;
      }
    },
    read: (key) => readFile(full(key)),
    stream: (key) => createReadStream(full(key)),
    async exists(key) {
      try {
        await stat(full(key));
        return true;
      } catch {
        return false;
      }
    },
    async delete(key) {
      await rm(full(key), { force: true });
    },
    async *list() {
      for (const top of ["photos", "closeups"]) {
        let shards: string[];
        try {
          shards = await readdir(path.join(dir, top));
        } catch {
          continue;
        }
        for (const shard of shards) {
          const names = await readdir(path.join(dir, top, shard)).catch(() => [] as string[]);
          for (const name of names) {
            const s = await stat(path.join(dir, top, shard, name)).catch(() => null);
            if (s?.isFile()) yield { key: `${top}/${shard}/${name}`, modifiedAt: s.mtime, partial: name.endsWith(".partial") };
          }
        }
      }
    },
  };
}

/** Deletes a possibly partial file by its listed key (which may not match KEY_PATTERN). */
export async function removeListed(root: string, key: string): Promise<void> {
  if (key.includes("..") || path.isAbsolute(key)) return;
  await rm(path.join(path.resolve(root), key), { force: true });
}

/**
 * Removes a finished file only if it is still as old as the clean-up saw it. An upload of the same bytes writes the
 * same key afresh (put() always writes) and then its row, so the file is first moved aside atomically under a
 * `.partial` name: if what was moved turns out to be new (a put() landed between the listing and now), it goes
 * back; a crash in between leaves only a `.partial` file, which the next pass removes. Returns whether it removed.
 */
export async function removeIfOlder(root: string, key: string, cutoffMs: number): Promise<boolean> {
  if (key.includes("..") || path.isAbsolute(key)) return false;
  const target = path.join(path.resolve(root), key);
  const before = await stat(target).catch(() => null);
  if (!before || before.mtime.getTime() > cutoffMs) return false;
  const aside = `${target}.${randomBytes(6).toString("hex")}.removing.partial`;
  try {
    await rename(target, aside);
  } catch {
    return false;
  }
  const moved = await stat(aside).catch(() => null);
  if (moved && moved.mtime.getTime() > cutoffMs) {
    await rename(aside, target);
    return false;
  }
  await rm(aside, { force: true });
  return true;
}

/** What removeIfOlder() names a file it has moved aside: `<key>.<12 hex>.removing.partial`. */
const ASIDE = /^(.+)\.[0-9a-f]{12}\.removing\.partial$/;

/**
 * A file left aside by a clean-up that died between moving it and deciding: when its key is referenced and no file
 * holds the key, it is put back (a put() of the same bytes raced the move). Returns whether it did.
 */
export async function returnIfNeeded(root: string, listedKey: string, referenced: Set<string>): Promise<boolean> {
  const key = ASIDE.exec(listedKey)?.[1];
  if (!key || !referenced.has(key) || key.includes("..") || path.isAbsolute(key)) return false;
  const base = path.resolve(root);
  if (await stat(path.join(base, key)).then(() => true, () => false)) return false;
  await rename(path.join(base, listedKey), path.join(base, key));
  return true;
}
