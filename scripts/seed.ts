/** `npm run seed` seeds the demo when the database is empty; `npm run seed -- --reset` rebuilds it. */
import path from "node:path";
import { ensureLocalDatabase } from "./local-db.ts";
import { localStorage } from "../server/lib/storage.ts";
import { connect } from "../server/db/connect-and-migrate.ts";
import { resetDemo, seedDemoIfEmpty } from "../server/demo/demo.ts";

if (process.env.NODE_ENV === "production") {
  console.error("The demo is never seeded when NODE_ENV=production.");
  process.exit(1);
}
await ensureLocalDatabase();
const database = await connect(process.env.DATABASE_URL!);
const password = process.env.DEMO_PASSWORD ?? "forthright-demo";
try {
  if (process.argv.includes("--reset")) {
    await resetDemo(database.db, { password, storage: localStorage(path.resolve(process.env.UPLOADS_DIR ?? "uploads")), publicUrl: process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`, log: console.log });
    console.log("Rebuilt the demo dealership.");
  } else {
    console.log((await seedDemoIfEmpty(database.db, { password, storage: localStorage(path.resolve(process.env.UPLOADS_DIR ?? "uploads")), publicUrl: process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`, log: console.log })) ? "Seeded the demo dealership." : "Demo data already present.");
  }
} finally {
  await database.close();
}
