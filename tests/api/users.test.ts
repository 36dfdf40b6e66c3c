import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const newUser = (n: number) => ({ email: `new${n}@demo.test`, name: `New Person ${n}`, role: "sales", password: "tallow bridge quarry lane" });

describe("GET /api/users", () => {
  it("when admin asks, then every staff member is listed without password hashes", async () => {
    const a = await t.signIn("admin");
    const res = await a.get("/api/users");
    expect(res.status).toBe(200);
    expect(res.body.users).toHaveLength(4);
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash/);
  });
  it("when nobody is signed in, then 401", async () => {
    expect((await request(t.app).get("/api/users")).status).toBe(401);
  });
  it.each(["sales", "workshop", "marketing"] as const)("when %s asks, then 403", async (role) => {
    const a = await t.signIn(role);
    const res = await a.get("/api/users");
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
  });
});

describe("POST /api/users", () => {
  it("when admin adds a user, then 201, the user can sign in, and the audit log records it", async () => {
    const a = await t.signIn("admin");
    const res = await a.post("/api/users").send(newUser(1));
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: "new1@demo.test", role: "sales", active: true, version: 1 });
    const signIn = await t.agent().post("/api/auth/sign-in").send({ email: "new1@demo.test", password: "tallow bridge quarry lane" });
    expect(signIn.status).toBe(200);
    const [rows] = await t.ctx.database.pool.query("select action, after from audit_log where entity_id = ?", [res.body.user.id]);
    expect((rows as Array<{ action: string }>).map((r) => r.action)).toContain("user_created");
  });
  it("when the fields are bad, then 400 with every field named", async () => {
    const a = await t.signIn("admin");
    const res = await a.post("/api/users").send({ email: "x", name: "", role: "owner", password: "short" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["email", "name", "password", "role"]);
  });
  it("when the password is a common one, then 400 on password", async () => {
    const a = await t.signIn("admin");
    // "1q2w3e4r5t6y" appears in the zxcvbn-ts common-password list (@zxcvbn-ts/language-common).
    const res = await a.post("/api/users").send({ ...newUser(2), password: "1q2w3e4r5t6y" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/common/);
  });
  it("when the e-mail is taken, then 400 on email", async () => {
    const a = await t.signIn("admin");
    const res = await a.post("/api/users").send({ ...newUser(3), email: "sales@demo.test" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBeTruthy();
  });
  it("when sales tries, then 403 and nothing is created", async () => {
    const a = await t.signIn("sales");
    expect((await a.post("/api/users").send(newUser(4))).status).toBe(403);
    const admin = await t.signIn("admin");
    const list = await admin.get("/api/users");
    expect(list.body.users.map((u: { email: string }) => u.email)).not.toContain("new4@demo.test");
  });
  it("when the request is cross-origin, then 403 even for an admin's cookie", async () => {
    const a = await t.signIn("admin");
    const res = await a.post("/api/users").set("Origin", "https://attacker.example").send(newUser(5));
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
  });
});

describe("PATCH /api/users/:id", () => {
  async function userByEmail(email: string) {
    const a = await t.signIn("admin");
    const list = await a.get("/api/users");
    return list.body.users.find((u: { email: string }) => u.email === email);
  }

  it("when a user is deactivated, then their existing session stops working at once", async () => {
    const workshop = await t.signIn("workshop");
    expect((await workshop.get("/api/auth/session")).body.user.role).toBe("workshop");
    const target = await userByEmail("workshop@demo.test");
    const a = await t.signIn("admin");
    const res = await a.patch(`/api/users/${target.id}`).send({ version: target.version, active: false });
    expect(res.status).toBe(200);
    expect(res.body.user.active).toBe(false);
    expect((await workshop.get("/api/auth/session")).body.user).toBeNull();
    const again = await t.agent().post("/api/auth/sign-in").send({ email: "workshop@demo.test", password: "forthright-test-password" });
    expect(again.status).toBe(401);
    await a.patch(`/api/users/${target.id}`).send({ version: res.body.user.version, active: true });
  });

  it("when the version is stale, then 409 and nothing changes", async () => {
    const target = await userByEmail("marketing@demo.test");
    const a = await t.signIn("admin");
    const first = await a.patch(`/api/users/${target.id}`).send({ version: target.version, name: "Mika A. Arlow" });
    expect(first.status).toBe(200);
    const stale = await a.patch(`/api/users/${target.id}`).send({ version: target.version, role: "admin" });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect((await userByEmail("marketing@demo.test")).role).toBe("marketing");
  });

  it("when the role changes, then the user's next request is judged by the new role", async () => {
    const target = await userByEmail("sales@demo.test");
    const sales = await t.signIn("sales");
    expect((await sales.get("/api/users")).status).toBe(403);
    const a = await t.signIn("admin");
    const res = await a.patch(`/api/users/${target.id}`).send({ version: target.version, role: "admin" });
    expect(res.status).toBe(200);
    expect((await sales.get("/api/users")).status).toBe(200);
    await a.patch(`/api/users/${target.id}`).send({ version: res.body.user.version, role: "sales" });
  });

  it("when the last admin would be demoted, then 409", async () => {
    const me = await userByEmail("admin@demo.test");
    const a = await t.signIn("admin");
    const res = await a.patch(`/api/users/${me.id}`).send({ version: me.version, role: "sales" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("last_admin");
  });

  it("when the user does not exist, then 404", async () => {
    const a = await t.signIn("admin");
    expect((await a.patch("/api/users/nobody").send({ version: 1, name: "X" })).status).toBe(404);
  });

  it("when the body is invalid, then 400 with fields", async () => {
    const target = await userByEmail("sales@demo.test");
    const a = await t.signIn("admin");
    const res = await a.patch(`/api/users/${target.id}`).send({ version: "one", active: "yes" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["active", "version"]);
  });

  it("when marketing tries, then 403; when signed out, then 401", async () => {
    const target = await userByEmail("sales@demo.test");
    const m = await t.signIn("marketing");
    expect((await m.patch(`/api/users/${target.id}`).send({ version: target.version, role: "admin" })).status).toBe(403);
    expect((await request(t.app).patch(`/api/users/${target.id}`).set("Origin", ORIGIN).send({ version: 1 })).status).toBe(401);
  });
});
