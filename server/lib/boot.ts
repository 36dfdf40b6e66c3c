import { pino, type Logger } from "pino";
import { sql } from "drizzle-orm";
import { loadConfig, type Config } from "../config/index.ts";
import { connect } from "../db/client.ts";
import { applyMigrations } from "../db/migrate.ts";
import { createAuth } from "../modules/auth/lucia.ts";
import { createLimiters, defaultLimits, type LimitSettings } from "../middleware/rate-limit.ts";
import type { AppContext } from "./context.ts";
import path from "node:path";
import { localStorage } from "./storage.ts";
import { PhotoWorker } from "../modules/photos/photo-worker.ts";
import { MailSender } from "../modules/mail/outbox.ts";

export function createLogger(config: Config): Logger {
  return pino({ level: config.LOG_LEVEL, redact: ["req.headers.cookie", "req.headers.authorization"] });
}

/** The boot's durability rule on the server's answer: anything but 1 can lose acknowledged commits in a crash. */
export function assertDurable(flushLogAtTrxCommit: unknown): void {
  const value = Number(flushLogAtTrxCommit);
  if (value !== 1) {
    throw new Error(`MariaDB has innodb_flush_log_at_trx_commit=${String(flushLogAtTrxCommit)}; Forthright needs 1 so no acknowledged write is lost.`);
  }
}

/** Every acknowledged commit must survive a crash; refuse to run on a server configured otherwise. */
async function checkDurability(ctx: AppContext) {
  const [rows] = (await ctx.database.db.execute(sql`select @@innodb_flush_log_at_trx_commit as v`)) as unknown as [Array<{ v: number }>];
  assertDurable(rows[0]?.v);
}

/** Serialises migrations between instances that start together. */
async function migrateWithLock(ctx: AppContext) {
  const conn = await ctx.database.pool.getConnection();
  try {
    await conn.query("SELECT GET_LOCK(CONCAT(DATABASE(), ':migrate'), 60)");
    await applyMigrations(ctx.database.db);
  } finally {
    await conn.query("SELECT RELEASE_LOCK(CONCAT(DATABASE(), ':migrate'))").catch(() => undefined);
    conn.release();
  }
}

export interface BootOptions {
  env?: NodeJS.ProcessEnv;
  config?: Partial<Config>;
  limits?: LimitSettings;
  logger?: Logger;
  now?: () => Date;
  migrate?: boolean;
  uploadsDir?: string;
}

export async function createContext(options: BootOptions = {}): Promise<AppContext> {
  const config = { ...loadConfig(options.env), ...options.config } as Config;
  const logger = options.logger ?? createLogger(config);
  const database = connect(config.DATABASE_URL);
  const uploadsDir = path.resolve(options.uploadsDir ?? config.UPLOADS_DIR);
  const storage = localStorage(uploadsDir);
  const auth = createAuth(database.db, { secure: config.publicUrl.startsWith("https:"), sessionDays: config.SESSION_DAYS });
  const ctx: AppContext = {
    config,
    database,
    auth,
    limiters: createLimiters(database.pool, new URL(config.DATABASE_URL).pathname.slice(1), options.limits ?? defaultLimits),
    logger,
    storage,
    uploadsDir,
    photoWorker: new PhotoWorker(database, storage, logger),
    mail: new MailSender(
      database,
      config.demoMail
        ? { host: "127.0.0.1", port: config.FAKE_SMTP_PORT, secure: false, from: config.MAIL_FROM }
        : {
            host: config.SMTP_HOST!,
            port: config.SMTP_PORT,
            secure: config.SMTP_SECURE,
            user: config.SMTP_USER,
            pass: config.SMTP_PASS,
            from: config.MAIL_FROM,
          },
      logger,
      options.now,
    ),
    now: options.now ?? (() => new Date()),
  };
  await checkDurability(ctx);
  if (options.migrate !== false) await migrateWithLock(ctx);
  return ctx;
}
