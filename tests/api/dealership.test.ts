import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { startTestApp, type TestApp } from "../support/app.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe("dealership settings", () => {
  it("when anyone asks for the public details, then only public fields are returned", async () => {
    const res = await request(t.app).get("/api/public/dealership");
    expect(res.status).toBe(200);
    expect(res.body.dealership.name).toBe("Fernhollow Motors");
    expect(res.body.dealership).not.toHaveProperty("disclaimerMarkdown");
    expect(res.body.dealership).not.toHaveProperty("minPhotos");
  });

  it.each(["admin", "sales", "workshop", "marketing"] as const)("when %s reads the staff view, then 200", async (role) => {
    const a = await t.signIn(role);
    const res = await a.get("/api/dealership");
    expect(res.status).toBe(200);
    expect(res.body.dealership.legalMinTreadMm).toBe(1.5);
  });

  it("when admin saves with the current version, then it is stored, versioned and audited", async () => {
    const a = await t.signIn("admin");
    const { body } = await a.get("/api/dealership");
    const res = await a.patch("/api/dealership").send({ version: body.dealership.version, phone: "+61 7 5550 9999", minPhotos: 8 });
    expect(res.status).toBe(200);
    expect(res.body.dealership).toMatchObject({ phone: "+61 7 5550 9999", minPhotos: 8, version: body.dealership.version + 1 });
    const stale = await a.patch("/api/dealership").send({ version: body.dealership.version, phone: "+61 7 0000 0000" });
    expect(stale.status).toBe(409);
    const [rows] = await t.ctx.database.pool.query("select action from audit_log where entity_type = 'dealership'");
    expect(rows).toHaveLength(1);
  });

  it("when values are out of range, then 400 names each", async () => {
    const a = await t.signIn("admin");
    const { body } = await a.get("/api/dealership");
    const res = await a.patch("/api/dealership").send({ version: body.dealership.version, legalMinTreadMm: 40, currency: "dollars", email: "nope" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["currency", "email", "legalMinTreadMm"]);
  });

  it.each(["sales", "workshop", "marketing"] as const)("when %s tries to change settings, then 403", async (role) => {
    const a = await t.signIn(role);
    expect((await a.patch("/api/dealership").send({ version: 1, name: "X" })).status).toBe(403);
  });
});
