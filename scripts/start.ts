/**
 * `npm start`: database up (installing MariaDB if needed), migrations, demo seed on first start, client build,
 * then the server on http://127.0.0.1:3000.
 */
import { build } from "vite";
import path from "node:path";
import { ensureLocalDatabase } from "./local-db.ts";
import { localStorage } from "../server/lib/storage.ts";
import { connect } from "../server/db/connect-and-migrate.ts";
import { seedDemoIfEmpty, DEMO_USERS } from "../server/demo/demo.ts";
import { main } from "../server/index.ts";

await ensureLocalDatabase();
const production = process.env.NODE_ENV === "production";
const password = process.env.DEMO_PASSWORD ?? "forthright-demo";
{
  const database = await connect(process.env.DATABASE_URL!);
  try {
    if (!production) {
      console.log("Checking for demo data…");
      const seeded = await seedDemoIfEmpty(database.db, { password, storage: localStorage(path.resolve(process.env.UPLOADS_DIR ?? "uploads")), publicUrl: process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`, log: console.log });
      console.log(seeded ? "Seeded the demo dealership." : "Demo data already present; keeping it.");
    }
  } finally {
    await database.close();
  }
}
if (process.env.SKIP_BUILD !== "1") {
  console.log("Building the client…");
  // Vite sets NODE_ENV=production for the build; the server must keep the mode it was started in (demo or not).
  const mode = process.env.NODE_ENV;
  await build({ logLevel: "warn" });
  if (mode === undefined) delete process.env.NODE_ENV;
  else process.env.NODE_ENV = mode;
}
const { ctx } = await main();
console.log(`\nForthright is running at ${ctx.config.publicUrl}\n`);
if (!production) {
  console.log("Demo sign-ins (password: " + (process.env.DEMO_PASSWORD ? "the value of DEMO_PASSWORD" : password) + "):");
  for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(10)} ${u.email}`);
  console.log("\nStop the database later with `npm run db:stop`.\n");
}
