import request from "supertest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Express } from "express";
import { pino, type Logger } from "pino";
import { createApp } from "../../server/app.ts";
import { createContext } from "../../server/lib/boot.ts";
import type { AppContext } from "../../server/lib/context.ts";
import { seedDemo, DEMO_USERS } from "../../server/demo/demo.ts";
import { defaultLimits, type LimitSettings } from "../../server/middleware/rate-limit.ts";
import type { Role } from "../../shared/constants/roles.ts";
import { createTestDatabase } from "./database.ts";

export const ORIGIN = "http://127.0.0.1:3000";
/** The Host a browser on ORIGIN sends: the configured host (server/middleware/origin-check.ts refuses writes to others). */
export const HOST = new URL(ORIGIN).host;
export const DEMO_PASSWORD = "forthright-test-password";

export interface TestApp {
  app: Express;
  ctx: AppContext;
  /** A supertest agent that sends our Origin and Host headers, as a browser on our pages would. */
  agent: () => ReturnType<typeof request.agent>;
  signIn: (role: Role) => Promise<ReturnType<typeof request.agent>>;
  close: () => Promise<void>;
}

/** Supertest agents on an in-process app: one that sends our Origin header, and one signed in as a demo staff role. */
export function agentsFor(app: Express): Pick<TestApp, "agent" | "signIn"> {
  const agent = () => request.agent(app).set("Origin", ORIGIN).set("Host", HOST);
  return {
    agent,
    async signIn(role: Role) {
      const a = agent();
      const email = DEMO_USERS.find((u) => u.role === role)!.email;
      const res = await a.post("/api/auth/sign-in").send({ email, password: DEMO_PASSWORD });
      if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return a;
    },
  };
}

const lots = { points: 1000, durationSeconds: 900 };
const generous: LimitSettings = {
  ...defaultLimits,
  signInPerAddress: lots,
  signInPerPair: lots,
  signInPerAccount: lots,
  enquiryPerAddress: lots,
  enquiryPerVehicle: lots,
  resetPerAddress: lots,
  resetPerAccount: lots,
};

/** createApp() on its own database, seeded with the demo dealership and its four staff. */
export async function startTestApp(
  options: { limits?: LimitSettings; seed?: boolean; env?: NodeJS.ProcessEnv; logger?: Logger } = {},
): Promise<TestApp> {
  const database = createTestDatabase();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-test-uploads-"));
  const ctx = await createContext({
    uploadsDir,
    env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent", ...options.env },
    logger: options.logger ?? pino({ level: "silent" }),
    limits: options.limits ?? generous,
  });
  if (options.seed !== false) await seedDemo(ctx.database.db, { password: DEMO_PASSWORD });
  const app = createApp(ctx);
  return {
    app,
    ctx,
    ...agentsFor(app),
    async close() {
      await ctx.photoWorker.stop();
      await ctx.database.close();
      rmSync(uploadsDir, { recursive: true, force: true });
      database.drop();
    },
  };
}

export const ROLES_ALL: Role[] = ["admin", "sales", "workshop", "marketing"];
