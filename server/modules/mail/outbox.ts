import { and, asc, eq, lte, sql } from "drizzle-orm";
import nodemailer, { type Transporter } from "nodemailer";
import type { Logger } from "pino";
import type { Database, DbOrTx } from "../../db/client.ts";
import { outbox } from "../../db/schema/index.ts";
import { BackgroundLoop } from "../../lib/background-loop.ts";

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string;
  kind: string;
}

/** Queues a mail inside the caller's transaction; it goes out only if the transaction commits. */
export async function enqueueMail(db: DbOrTx, mail: Mail, now = new Date()): Promise<number> {
  const [res] = await db.insert(outbox).values({
    toAddress: mail.to, subject: mail.subject.slice(0, 300), text: mail.text, html: mail.html, kind: mail.kind, nextAttemptAt: now,
  });
  return res.insertId;
}

export interface SmtpSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  pass?: string;
  from: string;
}

/** Backoff between attempts: 10 s, 30 s, 1 min, 5 min, then every 15 min; given up after a day. */
const BACKOFF_MS = [10_000, 30_000, 60_000, 300_000, 900_000];
const GIVE_UP_AFTER = 24 * 60 * 60 * 1000;

/**
 * Sends what the outbox holds, oldest first. The table is the queue, so a crash or an SMTP outage loses nothing
 * and any instance may send; a row lock (SKIP LOCKED) keeps two instances from sending the same mail.
 */
export class MailSender extends BackgroundLoop {
  private transport: Transporter;

  constructor(
    private readonly database: Database,
    private settings: SmtpSettings,
    private readonly logger: Logger,
    private readonly now: () => Date = () => new Date(),
    pollMs = 5000,
  ) {
    super(pollMs);
    this.transport = this.makeTransport();
  }

  private makeTransport() {
    const s = this.settings;
    return nodemailer.createTransport({
      host: s.host,
      port: s.port,
      secure: s.secure,
      ignoreTLS: s.host === "127.0.0.1" && !s.secure,
      auth: s.user ? { user: s.user, pass: s.pass ?? "" } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10000,
    });
  }

  /** Points the sender elsewhere (tests move the fake server). */
  retarget(settings: Partial<SmtpSettings>) {
    this.settings = { ...this.settings, ...settings };
    this.transport = this.makeTransport();
  }

  override async stop() {
    await super.stop();
    this.transport.close();
  }

  protected async drain() {
    for (let round = 0; round < 100 && !this.stopped; round++) {
      const sent = await this.sendOne().catch((err) => {
        this.logger.error({ err }, "outbox pass failed");
        return false;
      });
      if (!sent) return;
    }
  }

  /** Claims and sends one due mail; false when there is none. */
  private async sendOne(): Promise<boolean> {
    const now = this.now();
    return this.database.db.transaction(async (tx) => {
      const [row] = await tx
        .select()
        .from(outbox)
        .where(and(eq(outbox.status, "pending"), lte(outbox.nextAttemptAt, now)))
        .orderBy(asc(outbox.nextAttemptAt), asc(outbox.id))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!row) return false;
      try {
        await this.transport.sendMail({ from: this.settings.from, to: row.toAddress, subject: row.subject, text: row.text, html: row.html });
        await tx.update(outbox).set({ status: "sent", sentAt: now, attempts: row.attempts + 1, lastError: null }).where(eq(outbox.id, row.id));
        return true;
      } catch (err) {
        const attempts = row.attempts + 1;
        const gaveUp = now.getTime() - row.createdAt.getTime() > GIVE_UP_AFTER;
        const wait = BACKOFF_MS[Math.min(attempts - 1, BACKOFF_MS.length - 1)];
        await tx
          .update(outbox)
          .set({ attempts, status: gaveUp ? "failed" : "pending", nextAttemptAt: new Date(now.getTime() + wait), lastError: String((err as Error).message).slice(0, 500) })
          .where(eq(outbox.id, row.id));
        this.logger.warn({ outboxId: row.id, attempts, err: (err as Error).message }, "mail not sent; will retry");
        // Stop this pass: if one send failed, the server is likely down; the poll tries again later.
        return false;
      }
    });
  }

  /** Makes every pending mail due now (tests, and an admin's "retry now"). */
  async retryNow() {
    await this.database.db.update(outbox).set({ nextAttemptAt: sql`now(3)` }).where(eq(outbox.status, "pending"));
    this.kick();
  }
}
