import type { Logger } from "pino";
import type { Config } from "../config/index.ts";
import type { Database } from "../db/client.ts";
import type { Auth } from "../modules/auth/lucia.ts";
import type { Limiters } from "../middleware/rate-limit.ts";
import type { Storage } from "./storage.ts";
import type { PhotoWorker } from "../modules/photos/photo-worker.ts";
import type { MailSender } from "../modules/mail/outbox.ts";

/** Everything a request handler may need, built once at boot and handed to createApp(). */
export interface AppContext {
  config: Config;
  database: Database;
  auth: Auth;
  limiters: Limiters;
  logger: Logger;
  storage: Storage;
  /** Absolute path of the local uploads folder (the default storage). */
  uploadsDir: string;
  photoWorker: PhotoWorker;
  mail: MailSender;
  /** The clock, injectable so tests can move time. */
  now: () => Date;
}
