import type { TestApp } from "./app.ts";
import { startFakeSmtp } from "../../server/modules/mail/fake-smtp.ts";

export interface CapturedMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/**
 * A real SMTP server on a free loopback port that stores what it receives, with the app's mail sender pointed at
 * it. `down()` and `up()` stage an outage; `captured()` waits for the outbox and reads what arrived.
 */
export async function catchMail(t: TestApp) {
  let server: Awaited<ReturnType<typeof startFakeSmtp>> | null = await startFakeSmtp(t.ctx.database, 0);
  t.ctx.mail.retarget({ port: server.port });
  return {
    async down() {
      await server?.close();
      server = null;
    },
    async up() {
      server = await startFakeSmtp(t.ctx.database, 0);
      t.ctx.mail.retarget({ port: server.port });
    },
    async captured(): Promise<CapturedMail[]> {
      await t.ctx.mail.settled();
      const [rows] = await t.ctx.database.pool.query("select to_address as `to`, subject, text, html from captured_mail order by id");
      return rows as CapturedMail[];
    },
    async close() {
      await t.ctx.mail.stop();
      await server?.close();
      server = null;
    },
  };
}
