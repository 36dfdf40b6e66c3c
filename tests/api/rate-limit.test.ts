import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, startTestApp, type TestApp } from "../support/app.ts";
import { defaultLimits } from "../../server/middleware/rate-limit.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({
    limits: {
      ...defaultLimits,
      signInPerAddress: { points: 6, durationSeconds: 600, blockSeconds: 600 },
      signInPerAccount: { points: 3, durationSeconds: 600 },
    },
  });
});
afterAll(() => t.close());

describe("sign-in rate limits (counters in MariaDB)", () => {
  it("when an account fails too often, then 429 with a wait time, even for the right password", async () => {
    for (let i = 0; i < 3; i++) {
      const r = await t.agent().post("/api/auth/sign-in").send({ email: "sales@demo.test", password: `wrong-password-${i}` });
      expect(r.status).toBe(401);
    }
    const blocked = await t.agent().post("/api/auth/sign-in").send({ email: "sales@demo.test", password: DEMO_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("rate_limited");
    expect(blocked.body.error.message).toMatch(/minute/);
    expect(Number(blocked.headers["retry-after"])).toBeGreaterThan(0);
  });

  it("when one address fails too often, then 429 for any account from it", async () => {
    // Three failures were made above (the refused fourth attempt counts nothing); three more reach the address limit of 6.
    // Successes count against nothing (tests/api/sign-in-limits.test.ts).
    for (const email of ["admin@demo.test", "workshop@demo.test", "nobody@demo.test"]) {
      expect((await t.agent().post("/api/auth/sign-in").send({ email, password: "wrong-password-x" })).status).toBe(401);
    }
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "admin@demo.test", password: DEMO_PASSWORD });
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/network/);
  });

  it("when the counters are read, then they are rows in the shared rate_limits table", async () => {
    const [rows] = await t.ctx.database.pool.query("select `key` from rate_limits");
    expect((rows as Array<{ key: string }>).map((r) => r.key)).toEqual(expect.arrayContaining([expect.stringMatching(/^sign_in_ip:/), "sign_in_account:sales@demo.test"]));
  });
});
