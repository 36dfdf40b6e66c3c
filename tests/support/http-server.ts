import { createServer, type Server } from "node:http";
import type { Express } from "express";

/** Listens on a free loopback port; the browser tests talk to a real server. */
export async function listen(app: Express): Promise<{ url: string; server: Server; close: () => Promise<void> }> {
  const server = createServer(app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  return {
    url: `http://127.0.0.1:${port}`,
    server,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
