/** `npm run dev`: database up, the API restarting on change (tsx watch), and Vite's dev server with the API proxied. */
import { spawn } from "node:child_process";
import path from "node:path";
import { ensureLocalDatabase } from "./local-db.ts";
import { localStorage } from "../server/lib/storage.ts";
import { connect } from "../server/db/connect-and-migrate.ts";
import { seedDemoIfEmpty } from "../server/demo/demo.ts";

await ensureLocalDatabase();
const database = await connect(process.env.DATABASE_URL!);
await seedDemoIfEmpty(database.db, { password: process.env.DEMO_PASSWORD ?? "forthright-demo", storage: localStorage(path.resolve(process.env.UPLOADS_DIR ?? "uploads")), publicUrl: process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`, log: console.log });
await database.close();

const port = process.env.PORT ?? "3000";
const env = { ...process.env, PORT: port, PUBLIC_URL: process.env.PUBLIC_URL ?? "http://127.0.0.1:5173" };
const children = [
  spawn("node_modules/.bin/tsx", ["watch", "--clear-screen=false", "server/index.ts"], { stdio: "inherit", env }),
  spawn("node_modules/.bin/vite", [], { stdio: "inherit", env }),
];
const stop = () => {
  for (const c of children) c.kill("SIGTERM");
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
console.log("Open http://127.0.0.1:5173 (the API answers on port " + port + ").");
