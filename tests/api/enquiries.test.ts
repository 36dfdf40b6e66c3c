import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { catchMail } from "../support/mail.ts";
import { defaultLimits } from "../../server/middleware/rate-limit.ts";

let t: TestApp;
let mail: Awaited<ReturnType<typeof catchMail>>;
let slug: string;
let vehicleId: number;

beforeAll(async () => {
  t = await startTestApp();
  mail = await catchMail(t);
  ({ slug, vehicleId } = await publishReadyVehicle(t));
});
afterAll(async () => {
  await mail.close();
  await t.close();
});

const enquiry = (over: Record<string, unknown> = {}) => ({
  name: "Jo Marlowe",
  email: "jo.marlowe@example.test",
  phone: "",
  message: "Is the tow bar rated for a 2-tonne caravan? Could I see it on Saturday?",
  preferredContact: "email",
  tradeIn: { make: "Corvane", model: "Pimlet", year: 2014, odometerKm: 150_000 },
  consent: true,
  website: "",
  startedAt: Date.now() - 20_000,
  revision: 1,
  ...over,
});

const captured = () => mail.captured();
const leadCount = async () => Number(((await t.ctx.database.pool.query("select count(*) as n from leads"))[0] as Array<{ n: number }>)[0].n);

describe("a buyer's enquiry", () => {
  it("when a buyer enquires, then a lead is made for that revision and both mails arrive over real SMTP with working links", async () => {
    const res = await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry());
    expect(res.status).toBe(201);
    expect(res.body.next).toMatch(/reply/);
    const sales = await t.signIn("sales");
    const leads = (await sales.get("/api/leads")).body.leads;
    const lead = leads.find((l: { vehicleId: number }) => l.vehicleId === vehicleId);
    expect(lead).toMatchObject({ name: "Jo Marlowe", status: "waiting", revisionNumber: 1 });
    const mails = await captured();
    const toBuyer = mails.find((m) => m.to.includes("jo.marlowe@example.test"))!;
    // The vehicle was taken in by sales, so its enquiries go to that salesperson.
    const toStaff = mails.find((m) => m.to.includes("sales@demo.test"))!;
    expect(toBuyer.subject).toBe("We have your question about the 2019 Ambrel Loam");
    expect(toStaff.subject).toMatch(/^Enquiry: 2019 Ambrel Loam \(stock \d+\) from Jo Marlowe$/);
    expect(toStaff.text).toMatch(/Trade-in offered: 2014 Corvane Pimlet 150000 km/);
    for (const m of [toBuyer, toStaff]) {
      expect(m.html).not.toMatch(/<img/i);
      expect(m.text).toMatch(/Dealer licence MD 0048213/);
    }
    // Follow the link from the captured mail, as the buyer would.
    const link = toBuyer.text.match(/http:\/\/127\.0\.0\.1:3000(\/vehicles\/[a-z0-9-]+)/)![1];
    expect((await request(t.app).get(link)).status).toBe(200);
    const leadLink = toStaff.text.match(/http:\/\/127\.0\.0\.1:3000\/app\/leads\/(\d+)/)![1];
    expect((await sales.get(`/api/leads/${leadLink}`)).body.lead.name).toBe("Jo Marlowe");
  });

  it("when neither e-mail nor phone is given, or consent is missing, then 400 names the fields and nothing is stored", async () => {
    const before = await leadCount();
    const res = await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry({ email: "", phone: "", consent: false, message: "" }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["consent", "email", "message", "phone"]);
    expect(await leadCount()).toBe(before);
  });

  it("when a script fills the hidden field or submits instantly, then it is told all is well and nothing is stored", async () => {
    const before = await leadCount();
    expect((await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry({ website: "http://spam.example" }))).status).toBe(201);
    expect((await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry({ startedAt: Date.now() }))).status).toBe(201);
    expect(await leadCount()).toBe(before);
  });

  it("when the enquiry is for an unpublished address, then 404", async () => {
    expect((await request(t.app).post("/api/public/vehicles/2000-none-1/enquiries").set("Origin", ORIGIN).send(enquiry())).status).toBe(404);
  });

  it("when the SMTP server is down, then the enquiry is still stored, and the buyer's confirmation arrives once it is back", async () => {
    await mail.down();
    const res = await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry({ name: "Ari Vance", email: "ari.vance@example.test" }));
    expect(res.status).toBe(201);
    await t.ctx.mail.settled();
    // Nothing is sent and nothing is lost: both mails wait in the outbox, and the one tried carries the error.
    const [pending] = (await t.ctx.database.pool.query("select to_address as t, status, attempts, last_error as e from outbox where status = 'pending'")) as unknown as [Array<{ t: string; attempts: number; e: string | null }>];
    expect(pending.some((p) => p.t === "ari.vance@example.test")).toBe(true);
    expect(pending.some((p) => p.attempts >= 1 && p.e)).toBe(true);
    await mail.up();
    await t.ctx.mail.retryNow();
    await t.ctx.mail.settled();
    // Two mails may have been waiting (staff and buyer); drain until both are out.
    await t.ctx.mail.retryNow();
    const mails = await captured();
    expect(mails.some((m) => m.to.includes("ari.vance@example.test") && /Ambrel Loam/.test(m.subject))).toBe(true);
  });
});

describe("the leads inbox", () => {
  it("when sales works a lead, then status, follow-up and notes are kept in its conversation, and a reply goes out by mail", async () => {
    const sales = await t.signIn("sales");
    const lead = (await sales.get("/api/leads")).body.leads[0];
    const upd = await sales.patch(`/api/leads/${lead.id}`).send({ version: lead.version, status: "test_drive", followUpOn: "2026-12-05", note: "Booked for Saturday 10am." });
    expect(upd.status).toBe(200);
    expect(upd.body.lead).toMatchObject({ status: "test_drive", followUpOn: "2026-12-05" });
    expect((await sales.patch(`/api/leads/${lead.id}`).send({ version: lead.version, status: "won" })).status).toBe(409);
    const reply = await sales.post(`/api/leads/${lead.id}/messages`).send({ body: "Yes, rated to 2,500 kg braked. See you Saturday." });
    expect(reply.status).toBe(201);
    const kinds = reply.body.lead.conversation.map((c: { kind: string }) => c.kind);
    expect(kinds).toEqual(expect.arrayContaining(["enquiry", "status", "note", "mail_out"]));
    const mails = await captured();
    expect(mails.some((m) => m.subject === "Re: your question about the 2019 Ambrel Loam" && /2,500 kg/.test(m.text))).toBe(true);
    const filtered = await sales.get("/api/leads").query({ status: "test_drive" });
    expect(filtered.body.leads.every((l: { status: string }) => l.status === "test_drive")).toBe(true);
  });

  it("when marketing asks, then it sees counts but no buyer; workshop sees nothing; signed out is 401", async () => {
    const m = await t.signIn("marketing");
    expect((await m.get("/api/leads")).status).toBe(403);
    const stats = await m.get("/api/leads/stats");
    expect(stats.status).toBe(200);
    expect(stats.body.perVehicle[0].n).toBeGreaterThan(0);
    expect(JSON.stringify(stats.body)).not.toMatch(/marlowe/i);
    const w = await t.signIn("workshop");
    expect((await w.get("/api/leads/stats")).status).toBe(403);
    expect((await w.get("/api/leads")).status).toBe(403);
    expect((await request(t.app).get("/api/leads")).status).toBe(401);
  });

  it("when sales sends a buyer the condition page, then the mail carries its link", async () => {
    const sales = await t.signIn("sales");
    const res = await sales.post(`/api/vehicles/${vehicleId}/share`).send({ email: "sam.buyer@example.test", name: "Sam", message: "The one we talked about." });
    expect(res.status).toBe(201);
    const mails = await captured();
    const m = mails.find((x) => x.to.includes("sam.buyer@example.test"))!;
    expect(m.text).toContain(`http://127.0.0.1:3000/vehicles/${slug}`);
    expect((await (await t.signIn("workshop")).post(`/api/vehicles/${vehicleId}/share`).send({ email: "x@example.test" })).status).toBe(403);
  });
});

describe("staff accounts by e-mail", () => {
  it("when an admin invites someone, then the invitee sets their own password with a single-use link and is signed in", async () => {
    const admin = await t.signIn("admin");
    const res = await admin.post("/api/users/invite").send({ email: "new.tech@demo.test", name: "Rue Calder", role: "workshop" });
    expect(res.status).toBe(201);
    const mail = (await captured()).find((m) => m.to.includes("new.tech@demo.test"))!;
    const token = mail.text.match(/accept-invite\?token=([A-Za-z0-9_-]+)/)![1];
    const [rows] = await t.ctx.database.pool.query("select token_hash as h from auth_tokens where email = 'new.tech@demo.test'");
    expect((rows as Array<{ h: string }>)[0].h).not.toContain(token);
    expect((await request(t.app).get(`/api/auth/invitations/${token}`)).body.invitation).toMatchObject({ email: "new.tech@demo.test", role: "workshop" });
    const accept = await request(t.app).post("/api/auth/invitations/accept").set("Origin", ORIGIN).send({ token, password: "copper kettle on the workbench" });
    expect(accept.status).toBe(201);
    expect(accept.body.user).toMatchObject({ email: "new.tech@demo.test", role: "workshop" });
    expect(String(accept.headers["set-cookie"])).toMatch(/forthright_session=/);
    const again = await request(t.app).post("/api/auth/invitations/accept").set("Origin", ORIGIN).send({ token, password: "another long passphrase" });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe("invalid_token");
  });

  it("when a password reset is asked for, then the answer is the same for any address, the link works once, and old sessions end", async () => {
    const old = await t.signIn("marketing");
    const known = await request(t.app).post("/api/auth/password-reset").set("Origin", ORIGIN).send({ email: "marketing@demo.test" });
    const unknown = await request(t.app).post("/api/auth/password-reset").set("Origin", ORIGIN).send({ email: "nobody@demo.test" });
    expect(known.status).toBe(200);
    expect(unknown.body).toEqual(known.body);
    const mail = (await captured()).filter((m) => m.to.includes("marketing@demo.test")).at(-1)!;
    const token = mail.text.match(/reset-password\?token=([A-Za-z0-9_-]+)/)![1];
    expect((await captured()).some((m) => m.to.includes("nobody@demo.test"))).toBe(false);
    const ok = await request(t.app).post("/api/auth/password-reset/confirm").set("Origin", ORIGIN).send({ token, password: "a new and rather long passphrase" });
    expect(ok.status).toBe(200);
    expect((await old.get("/api/auth/session")).body.user).toBeNull();
    expect((await request(t.app).post("/api/auth/password-reset/confirm").set("Origin", ORIGIN).send({ token, password: "yet another long passphrase" })).status).toBe(400);
    const signIn = await t.agent().post("/api/auth/sign-in").send({ email: "marketing@demo.test", password: "a new and rather long passphrase" });
    expect(signIn.status).toBe(200);
  });

  it("when a reset link is over an hour old, then it no longer works", async () => {
    await request(t.app).post("/api/auth/password-reset").set("Origin", ORIGIN).send({ email: "sales@demo.test" });
    const mail = (await captured()).filter((m) => m.to.includes("sales@demo.test") && /Reset/.test(m.subject)).at(-1)!;
    const token = mail.text.match(/reset-password\?token=([A-Za-z0-9_-]+)/)![1];
    await t.ctx.database.pool.query("update auth_tokens set expires_at = now(3) - interval 1 second where kind = 'reset' and email = 'sales@demo.test'");
    const res = await request(t.app).post("/api/auth/password-reset/confirm").set("Origin", ORIGIN).send({ token, password: "too late for this one" });
    expect(res.status).toBe(400);
  });
});

describe("enquiry rate limits", () => {
  it("when one address sends too many enquiries, then 429 with a clear message", async () => {
    const strict = await startTestApp({ limits: { ...defaultLimits, enquiryPerAddress: { points: 2, durationSeconds: 600 } } });
    try {
      const { slug: s } = await publishReadyVehicle(strict);
      const send = () => request(strict.app).post(`/api/public/vehicles/${s}/enquiries`).set("Origin", ORIGIN).send(enquiry());
      expect((await send()).status).toBe(201);
      expect((await send()).status).toBe(201);
      const third = await send();
      expect(third.status).toBe(429);
      expect(third.body.error.message).toMatch(/Too many enquiries/);
    } finally {
      await strict.ctx.mail.stop();
      await strict.close();
    }
  });
});
