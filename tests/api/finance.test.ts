import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { startTestApp, type TestApp } from "../support/app.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const URL = "/api/public/finance-estimate";

describe("GET /api/public/finance-estimate", () => {
  it("when anyone asks for 10,000.00 at 8 % over 10 months, then 1,037.03 a month, the totals, and a public cache", async () => {
    // SAS "PMT Function" and Microsoft's PMT example: 1037.03 (sources quoted in tests/unit/domain/finance.test.ts).
    const res = await request(t.app).get(URL).query({ amountCents: "1000000", aprPercent: "8", months: "10" });
    expect(res.status).toBe(200);
    expect(res.headers["cache-control"]).toBe("public, max-age=3600");
    expect(Object.keys(res.body).sort()).toEqual(["finalPaymentCents", "interestCents", "paymentCents", "totalCents"]);
    expect(res.body.paymentCents).toBe(103_703);
    expect(res.body.totalCents).toBe(103_703 * 9 + res.body.finalPaymentCents);
    expect(res.body.interestCents).toBe(res.body.totalCents - 1_000_000);
  });

  it("when the rate is 0 %, then the amount divided by the months and no interest", async () => {
    const res = await request(t.app).get(URL).query({ amountCents: "1200000", aprPercent: "0", months: "12" });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ paymentCents: 100_000, finalPaymentCents: 100_000, totalCents: 1_200_000, interestCents: 0 });
  });

  it("when a staff member asks, then the same answer but never stored (signed-in answers are no-store)", async () => {
    const a = await t.signIn("sales");
    const res = await a.get(URL).query({ amountCents: "1000000", aprPercent: "8", months: "10" });
    expect(res.status).toBe(200);
    expect(res.body.paymentCents).toBe(103_703);
    expect(res.headers["cache-control"]).toBe("no-store");
  });

  const good = { amountCents: "1000000", aprPercent: "8", months: "10" };
  it.each([
    ["amountCents", { ...good, amountCents: "0" }],
    ["amountCents", { ...good, amountCents: "-100000" }],
    ["amountCents", { ...good, amountCents: "100000.5" }],
    ["amountCents", { ...good, amountCents: "1000000001" }],
    ["aprPercent", { ...good, aprPercent: "60" }],
    ["aprPercent", { ...good, aprPercent: "-1" }],
    ["aprPercent", { ...good, aprPercent: "" }],
    ["aprPercent", { ...good, aprPercent: "6.1234" }],
    ["months", { ...good, months: "0" }],
    ["months", { ...good, months: "1.5" }],
    ["months", { ...good, months: "121" }],
    ["months", { ...good, months: "1e1" }],
  ])("when %s is out of range (%o), then 400 naming that field", async (field, query) => {
    const res = await request(t.app).get(URL).query(query);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
    expect(res.headers["cache-control"] ?? "").not.toContain("public");
  });

  it("when every parameter is missing, then 400 naming all three at once", async () => {
    const res = await request(t.app).get(URL);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["amountCents", "aprPercent", "months"]);
  });

  it("when one parameter is missing or one is unknown, then 400 naming it", async () => {
    const missing = await request(t.app).get(URL).query({ amountCents: "1000000", aprPercent: "8" });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(["months"]);
    const extra = await request(t.app).get(URL).query({ ...good, deposit: "1" });
    expect(extra.status).toBe(400);
    expect(JSON.stringify(extra.body.error)).toContain("deposit");
  });
});
