import { sql } from "drizzle-orm";
import type { Db } from "../../server/db/client.ts";

/**
 * Tables that change on requests that change nothing a person recorded, left out of "nothing changed" checks:
 * - sessions: signing in writes one, and lucia moves a session's expiry forward when it is half used;
 * - rate_limits: every sign-in, reset and enquiry attempt counts against the caller, refused or not (that is the point).
 */
export const VOLATILE_TABLES = ["sessions", "rate_limits"] as const;

/** CHECKSUM TABLE of every base table of the test database but the excluded ones: equal maps mean equal contents. */
export async function tableChecksums(db: Db, exclude: readonly string[] = VOLATILE_TABLES): Promise<Record<string, string>> {
  const [tables] = (await db.execute(
    sql`select table_name as name from information_schema.tables where table_schema = database() and table_type = 'BASE TABLE' order by table_name`,
  )) as unknown as [Array<{ name: string }>];
  const names = tables.map((t) => t.name).filter((n) => !exclude.includes(n));
  const [rows] = (await db.execute(sql.raw(`CHECKSUM TABLE ${names.map((n) => `\`${n}\``).join(", ")}`))) as unknown as [Array<{ Table: string; Checksum: string | number | null }>];
  return Object.fromEntries(rows.map((r) => [r.Table.split(".").pop()!, String(r.Checksum)]));
}

/** The tables whose checksums differ between two snapshots. */
export const changedTables = (before: Record<string, string>, after: Record<string, string>) =>
  Object.keys({ ...before, ...after }).filter((k) => before[k] !== after[k]);
