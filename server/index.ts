import { createServer } from "node:http";
import { createApp } from "./app.ts";
import { createContext } from "./lib/boot.ts";
import { removeOrphans } from "./modules/photos/cleanup.ts";
import { startFakeSmtp } from "./modules/mail/fake-smtp.ts";

/** Process entry: config, database, listen, and a graceful shutdown that lets requests in flight finish. */
export async function main() {
  const ctx = await createContext();
  const app = createApp(ctx);
  const server = createServer(app);
  server.keepAliveTimeout = 65_000;
  await new Promise<void>((resolve) => server.listen(ctx.config.PORT, ctx.config.HOST, resolve));
  ctx.logger.info({ url: ctx.config.publicUrl }, "Forthright is listening");
  ctx.photoWorker.start();
  // Demo mode: our own mail catcher on loopback; production sends through the configured SMTP server only.
  const fakeSmtp = ctx.config.demoMail
    ? await startFakeSmtp(ctx.database, ctx.config.FAKE_SMTP_PORT).catch((err: unknown) => {
        const message = err instanceof Error ? err.message : String(err);
        ctx.logger.warn({ err: message }, "demo mail catcher not started (port in use?); mail waits in the outbox");
        return null;
      })
    : null;
  ctx.mail.start();
  const cleanup = () =>
    removeOrphans(ctx.database, ctx.storage, ctx.uploadsDir)
      .then((removed) => removed.length && ctx.logger.info({ removed: removed.length }, "removed orphaned files"))
      .catch((err) => ctx.logger.error({ err }, "orphan clean-up failed"));
  void cleanup();
  setInterval(() => void cleanup(), 60 * 60 * 1000).unref();

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    ctx.logger.info({ signal }, "shutting down");
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    const finish = async () => {
      await ctx.photoWorker.stop().catch(() => undefined);
      await ctx.mail.stop().catch(() => undefined);
      await fakeSmtp?.close().catch(() => undefined);
      await ctx.database.close().catch(() => undefined);
      process.exit(0);
    };
    // Each step above already swallows its own failure; this catch is for the unexpected, which still exits.
    server.close(() => {
      void finish().catch((err: unknown) => {
        ctx.logger.error({ err }, "shutdown failed");
        process.exit(1);
      });
    });
    server.closeIdleConnections();
  };
  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGINT"));
  return { ctx, server };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
