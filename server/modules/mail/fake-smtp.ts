import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import type { Database } from "../../db/client.ts";
import { capturedMail } from "../../db/schema/index.ts";

/**
 * The demo's own mail catcher: a real SMTP server on loopback that stores every message it receives in MariaDB, where
 * the admin's outbox screen (and tests) read it. Never started in production.
 */
export async function startFakeSmtp(database: Database, port: number): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    banner: "Forthright demo mail catcher",
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const to = [mail.to].flat().filter(Boolean).map((a) => (a as { text: string }).text).join(", ");
          await database.db.insert(capturedMail).values({
            fromAddress: mail.from?.text ?? "",
            toAddress: to.slice(0, 1000),
            subject: (mail.subject ?? "").slice(0, 300),
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : "",
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const address = (server.server.address() as { port: number }).port;
  return { port: address, close: () => new Promise<void>((r) => server.close(() => r())) };
}
