import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pino } from "pino";
import { DEMO_PASSWORD, startTestApp, type TestApp } from "../support/app.ts";
import { defaultLimits } from "../../server/middleware/rate-limit.ts";

// Issue 16: every attempt counted against the address (an office locked itself out), and eight failures from
// anywhere locked an account even against the right password (anyone could lock out a known staff member).
// Now (rate-limiter-flexible's brute-force pattern): failures count per account-and-address pair and per address,
// successes count against nothing, and the per-account limit against distributed guessing refuses only addresses
// that never signed in to the account; from those it slows the attempts down instead.

const SLOW_MS = 400;
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({
    // Each test signs in from its own addresses, as the proxy in front says (X-Forwarded-For).
    env: { TRUST_PROXY: "true" },
    limits: {
      ...defaultLimits,
      signInPerAddress: { points: 6, durationSeconds: 600, blockSeconds: 600 },
      signInPerPair: { points: 3, durationSeconds: 600, blockSeconds: 600 },
      signInPerAccount: { points: 4, durationSeconds: 600 },
      signInSlowdown: { firstMs: SLOW_MS, maxMs: SLOW_MS * 2 },
    },
  });
});
afterAll(() => t?.close());

const attempt = async (email: string, password: string, from: string) => {
  const started = Date.now();
  const res = await t.agent().post("/api/auth/sign-in").set("X-Forwarded-For", from).send({ email, password });
  return Object.assign(res, { ms: Date.now() - started });
};
const fail = async (email: string, from: string, n = 1) => {
  for (let i = 0; i < n; i++) expect((await attempt(email, `not-the-password-${i}`, from)).status, `failure ${i + 1} from ${from}`).toBe(401);
};

describe("sign-in limits", () => {
  it("when one office signs in many times from one address, then successes never count against it", async () => {
    for (let i = 0; i < 10; i++) expect((await attempt("admin@demo.test", DEMO_PASSWORD, "10.0.0.1")).status, `sign-in ${i + 1}`).toBe(200);
  });

  it("when strangers elsewhere fail often against an account, then its owner still signs in from an address they used before, slowed, and new addresses are refused", async () => {
    expect((await attempt("sales@demo.test", DEMO_PASSWORD, "10.0.0.2")).status).toBe(200);
    for (let i = 0; i < 4; i++) await fail("sales@demo.test", `203.0.113.${i + 1}`);
    const stranger = await attempt("sales@demo.test", DEMO_PASSWORD, "203.0.113.99");
    expect(stranger.status).toBe(429);
    expect(stranger.body.error.message).toMatch(/Too many failed sign-ins for this account/);
    expect(Number(stranger.headers["retry-after"])).toBeGreaterThan(0);
    const owner = await attempt("sales@demo.test", DEMO_PASSWORD, "10.0.0.2");
    expect(owner.status).toBe(200);
    expect(owner.ms).toBeGreaterThanOrEqual(SLOW_MS - 20);
  });

  it("when one address fails repeatedly against one account, then that pair is refused, even the right password, and other addresses are not", async () => {
    await fail("workshop@demo.test", "198.51.100.7", 3);
    const res = await attempt("workshop@demo.test", DEMO_PASSWORD, "198.51.100.7");
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe("rate_limited");
    expect(res.body.error.message).toMatch(/minute/);
    expect((await attempt("workshop@demo.test", DEMO_PASSWORD, "198.51.100.8")).status).toBe(200);
  });

  it("when someone fails repeatedly from an address that has signed in to the account, then they are slowed, the right password still works and resets the pair", async () => {
    expect((await attempt("marketing@demo.test", DEMO_PASSWORD, "10.0.0.3")).status).toBe(200);
    await fail("marketing@demo.test", "10.0.0.3", 3);
    const slowed = await attempt("marketing@demo.test", "still-not-it", "10.0.0.3");
    expect(slowed.status).toBe(401);
    expect(slowed.ms).toBeGreaterThanOrEqual(SLOW_MS - 20);
    const right = await attempt("marketing@demo.test", DEMO_PASSWORD, "10.0.0.3");
    expect(right.status).toBe(200);
    // The success reset the pair: the next failure is one of three again, and the right password follows at once.
    await fail("marketing@demo.test", "10.0.0.3");
    expect((await attempt("marketing@demo.test", DEMO_PASSWORD, "10.0.0.3")).status).toBe(200);
  });

  it("when one address fails against many accounts, then it is refused for any account", async () => {
    for (let i = 0; i < 6; i++) await fail(`nobody-${i}@demo.test`, "192.0.2.1");
    const res = await attempt("admin@demo.test", DEMO_PASSWORD, "192.0.2.1");
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/network/);
    expect((await attempt("admin@demo.test", DEMO_PASSWORD, "192.0.2.2")).status).toBe(200);
  });

  it("when the counters are read, then they are rows in the shared rate_limits table, with no address or e-mail in a pair's key", async () => {
    const [rows] = await t.ctx.database.pool.query("select `key` from rate_limits");
    const keys = (rows as Array<{ key: string }>).map((r) => r.key);
    expect(keys).toEqual(expect.arrayContaining(["sign_in_ip:192.0.2.1", "sign_in_account:sales@demo.test", expect.stringMatching(/^sign_in_pair:[0-9a-f]{64}$/), expect.stringMatching(/^sign_in_known:[0-9a-f]{64}$/)]));
    for (const k of keys.filter((key) => /^sign_in_(pair|known):/.test(key))) expect(k).toMatch(/^sign_in_(pair|known):[0-9a-f]{64}$/);
  });
});

describe("X-Forwarded-For without TRUST_PROXY", () => {
  it("when requests carry X-Forwarded-For and TRUST_PROXY is off, then the server warns once that every client counts as the proxy", async () => {
    const lines: string[] = [];
    const logger = pino({ level: "warn" }, { write: (line: string) => void lines.push(line) });
    const proxied = await startTestApp({ seed: false, logger });
    try {
      await proxied.agent().get("/api/health").set("X-Forwarded-For", "203.0.113.5");
      await proxied.agent().get("/api/health").set("X-Forwarded-For", "203.0.113.6");
      const warnings = lines.filter((l) => l.includes("TRUST_PROXY"));
      expect(warnings).toHaveLength(1);
      expect(JSON.parse(warnings[0]).level).toBe(40);
    } finally {
      await proxied.close();
    }
  });
});
