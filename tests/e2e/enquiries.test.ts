import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import type { Browser, Page } from "playwright-core";
import { DEMO_PASSWORD, ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { launchBrowser, screenshot, watchErrors } from "../support/browser.ts";
import { listen } from "../support/http-server.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { catchMail } from "../support/mail.ts";

let t: TestApp;
let browser: Browser;
let server: Awaited<ReturnType<typeof listen>>;
let mail: Awaited<ReturnType<typeof catchMail>>;
let slug: string;
let vehicleId: number;

beforeAll(async () => {
  t = await startTestApp();
  mail = await catchMail(t);
  ({ slug, vehicleId } = await publishReadyVehicle(t));
  // As if an admin had taken the vehicle in: its enquiries reach the dealership's inbox unassigned, for sales to take.
  await t.ctx.database.pool.query("update vehicles set salesperson_id = null where id = ?", [vehicleId]);
  server = await listen(t.app);
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await server?.close();
  await mail?.close();
  await t?.close();
});

async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${server.url}/app`);
}

const captured = () => mail.captured();

const enquiry = (over: Record<string, unknown> = {}) => ({
  name: "Jo Marlowe",
  email: "jo.marlowe@example.test",
  phone: "07700 900123",
  message: "Is the tow bar rated for a 2-tonne caravan? Could I see it on Saturday?",
  preferredContact: "email",
  tradeIn: { make: "Corvane", model: "Pimlet", year: 2014, odometerKm: 150_000 },
  consent: true,
  website: "",
  startedAt: Date.now() - 20_000,
  revision: 1,
  ...over,
});

describe("leads in Chromium", () => {
  it("when a buyer has enquired, then sales finds the lead, takes it, replies by e-mail and books a test drive, and the admin sees the mail go out", async () => {
    const res = await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry());
    expect(res.status).toBe(201);
    await t.ctx.mail.settled();

    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    const errors = watchErrors(page);
    await signIn(page, "sales@demo.test");
    await page.getByRole("navigation", { name: "Staff" }).getByRole("link", { name: "Enquiries" }).click();
    await page.waitForURL(`${server.url}/app/leads`);
    const row = page.locator("tbody tr", { hasText: "Jo Marlowe" });
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.innerText()).toMatch(/Waiting for a reply/);
    expect(await row.innerText()).toMatch(/2019 Ambrel Loam/);
    expect(await row.getByRole("link", { name: /Ambrel Loam/ }).getAttribute("href")).toBe(`/app/vehicles/${vehicleId}`);
    await screenshot(page, "leads-inbox");

    // Filters live in the URL.
    await page.getByLabel("Assigned to").selectOption("unassigned");
    await page.waitForURL(/assignee=unassigned/);
    await expect.poll(() => row.count()).toBe(1);
    await page.getByLabel("Search enquiries").fill("nobody-of-that-name");
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/q=nobody-of-that-name/);
    await expect.poll(() => page.getByText("No enquiries match these filters").count()).toBe(1);
    await page.getByRole("button", { name: "Show every enquiry" }).click();

    await page.getByRole("link", { name: "Jo Marlowe" }).click();
    await page.waitForURL(/\/app\/leads\/\d+$/);
    const leadId = Number(page.url().split("/").at(-1));
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("Jo Marlowe");
    expect(await page.getByRole("link", { name: "jo.marlowe@example.test" }).getAttribute("href")).toBe("mailto:jo.marlowe@example.test");
    expect(await page.getByRole("link", { name: "07700 900123" }).getAttribute("href")).toBe("tel:07700900123");
    expect(await page.getByRole("link", { name: /revision 1 of the condition page/ }).getAttribute("href")).toBe(`/vehicles/${slug}/revisions/1`);
    expect(await page.locator("main").innerText()).toMatch(/2014 Corvane Pimlet/);

    await page.getByRole("button", { name: "Take this lead" }).click();
    await expect.poll(() => page.getByText("The lead is yours.").count()).toBe(1);

    await page.getByLabel("Your reply to Jo Marlowe").fill("Yes, rated to 2,500 kg braked. Saturday at 10 suits us.");
    await page.getByRole("button", { name: "Send reply by e-mail" }).click();
    await expect.poll(() => page.getByText("Reply queued").count()).toBe(1);
    // The first reply moves a waiting lead on to "In conversation".
    await expect.poll(() => page.getByLabel("Status").inputValue()).toBe("talking");
    await t.ctx.mail.settled();
    const conversation = page.getByRole("list", { name: "Conversation, oldest first" });
    await expect.poll(() => conversation.innerText(), { timeout: 10_000 }).toMatch(/E-mail to the buyer[\s\S]*Sent/);

    // Someone else changes the lead meanwhile: the save is refused, and what was typed survives the reload.
    const other = await t.signIn("admin");
    const current = (await other.get(`/api/leads/${leadId}`)).body.lead;
    expect((await other.patch(`/api/leads/${leadId}`).send({ version: current.version, note: "Customer called the yard." })).status).toBe(200);
    await page.getByLabel("Status").selectOption("test_drive");
    await page.getByLabel("Follow up on").fill("2030-06-01");
    await page.getByLabel("Add a note").fill("Test drive Saturday 10:00, bring the caravan hitch.");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => page.getByText("Someone else changed this lead while you were working").count()).toBe(1);
    await page.getByRole("button", { name: "Load the latest and keep my changes" }).click();
    await expect.poll(() => conversation.innerText()).toMatch(/Customer called the yard/);
    expect(await page.getByLabel("Add a note").inputValue()).toBe("Test drive Saturday 10:00, bring the caravan hitch.");
    expect(await page.getByLabel("Status").inputValue()).toBe("test_drive");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => page.getByText("Saved.").count()).toBe(1);
    await expect.poll(() => conversation.innerText()).toMatch(/In conversation → Test drive booked/);
    expect(await conversation.innerText()).toMatch(/bring the caravan hitch/);
    await screenshot(page, "lead-page");
    expect(errors.filter((e) => !/409|Conflict/.test(e))).toEqual([]);
    await page.close();

    const mails = await captured();
    expect(mails.some((m) => m.to.includes("jo.marlowe@example.test") && /2,500 kg/.test(m.text))).toBe(true);

    const admin = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    const adminErrors = watchErrors(admin);
    await signIn(admin, "admin@demo.test");
    await admin.getByRole("navigation", { name: "Staff" }).getByRole("link", { name: "Mail" }).click();
    await admin.waitForURL(`${server.url}/app/mail`);
    await expect.poll(() => admin.locator("tbody tr").count()).toBeGreaterThanOrEqual(3);
    expect(await admin.locator("tbody").innerText()).toMatch(/Reply to a buyer[\s\S]*Sent/);
    await expect.poll(() => admin.getByText("Captured by the demo mail catcher").count()).toBe(1);
    await admin.getByRole("button", { name: "Retry now" }).click();
    // The page lead also says mail is "tried again by itself"; the answer to the button is the status notice.
    await expect.poll(() => admin.getByRole("status").filter({ hasText: "Tried again" }).count()).toBe(1);
    await admin.getByRole("button", { name: /Re: your question about the 2019 Ambrel Loam/ }).click();
    const frame = admin.locator('iframe[sandbox=""]');
    await expect.poll(() => frame.count()).toBe(1);
    await expect.poll(() => admin.frameLocator('iframe[sandbox=""]').locator("body").innerText()).toMatch(/2,500 kg/);
    await admin.getByRole("button", { name: "Plain text" }).click();
    expect(await admin.locator("pre").innerText()).toMatch(/2,500 kg/);
    await admin.getByRole("button", { name: "As HTML" }).click();
    await expect.poll(() => admin.frameLocator('iframe[sandbox=""]').locator("body").innerText()).toMatch(/2,500 kg/);
    await admin.waitForTimeout(300); // let the sandboxed document paint before the full-page capture
    await screenshot(admin, "mail-outbox");
    expect(adminErrors).toEqual([]);
    await admin.close();
  }, 90_000);

  it("when marketing opens the enquiries, then it sees counts per vehicle and per source, and no buyer", async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    await signIn(page, "marketing@demo.test");
    await page.goto(`${server.url}/app/leads`);
    await expect.poll(() => page.getByRole("heading", { name: "Enquiries per vehicle" }).count()).toBe(1);
    const text = await page.locator("main").innerText();
    expect(text).toMatch(/2019 Ambrel Loam/);
    expect(text).toMatch(/Condition page enquiry form/);
    expect(text).not.toMatch(/Marlowe/);
    await screenshot(page, "leads-marketing-counts");
    await page.close();
  });
});

describe("account pages in Chromium", () => {
  it("when someone has forgotten their password, then the page gives the same answer for any address", async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const errors = watchErrors(page);
    await page.goto(`${server.url}/sign-in`);
    await page.getByRole("link", { name: "Forgotten your password?" }).click();
    await page.waitForURL(`${server.url}/forgot-password`);
    await page.getByLabel("E-mail").fill("not-an-address");
    await page.getByRole("button", { name: "Send me a link" }).click();
    await expect.poll(() => page.getByText(/valid e-mail address/).count()).toBe(1);
    await page.getByLabel("E-mail").fill("nobody@demo.test");
    await page.getByRole("button", { name: "Send me a link" }).click();
    await expect.poll(() => page.getByText(/If that address has an account, a link to reset the password is on its way/).count()).toBe(1);
    await screenshot(page, "forgot-password");
    expect(errors).toEqual([]);
    await page.close();
  });

  it("when an admin invites a colleague, then the link shows who and which role, the colleague chooses a password and lands in the staff area, and the link then no longer works", async () => {
    const admin = await t.signIn("admin");
    expect((await admin.post("/api/users/invite").send({ email: "rue.calder@demo.test", name: "Rue Calder", role: "workshop" })).status).toBe(201);
    await t.ctx.mail.settled();
    const [rows] = await t.ctx.database.pool.query("select text from captured_mail where to_address like '%rue.calder@demo.test%' order by id desc limit 1");
    const token = (rows as Array<{ text: string }>)[0].text.match(/accept-invite\?token=([A-Za-z0-9_-]+)/)![1];

    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const errors = watchErrors(page);
    await page.goto(`${server.url}/accept-invite?token=${token}`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("Welcome, Rue Calder");
    expect(await page.locator("main").innerText()).toMatch(/rue\.calder@demo\.test[\s\S]*Workshop/);
    await page.getByLabel("New password").fill("short");
    await page.getByRole("button", { name: "Create my account" }).click();
    await expect.poll(() => page.getByText(/at least 12 characters/i).count()).toBeGreaterThan(0);
    await page.getByLabel("New password").fill("copper kettle on the workbench");
    await page.getByLabel("The same password again").fill("copper kettle on the bench");
    await page.getByRole("button", { name: "Create my account" }).click();
    await expect.poll(() => page.getByText("The two passwords are not the same.").count()).toBe(1);
    await page.getByLabel("The same password again").fill("copper kettle on the workbench");
    await screenshot(page, "accept-invite");
    await page.getByRole("button", { name: "Create my account" }).click();
    await page.waitForURL(`${server.url}/app`);
    await expect.poll(() => page.getByTestId("signed-in-as").textContent().catch(() => "")).toMatch(/Rue Calder/);
    expect(errors).toEqual([]);

    await page.goto(`${server.url}/accept-invite?token=${token}`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("This link is no longer valid");
    await page.close();
  });
});

describe("the buyer's enquiry on a phone", () => {
  it("when a buyer sends a question from the condition page, then every problem shows at once, nothing typed is lost, and a thank-you says what happens next", async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const errors = watchErrors(page);
    await page.goto(`${server.url}/vehicles/${slug}`);
    const form = page.getByRole("form", { name: /Ask about the/ });
    await form.scrollIntoViewIfNeeded();
    await form.getByLabel("Your question").fill("Can I see it on Saturday morning?");
    await form.getByRole("button", { name: "Send my question" }).click();
    await expect.poll(() => form.getByText(/things to check before we can send this/).count()).toBe(1);
    expect(await form.innerText()).toMatch(/Tell us your name/);
    expect(await form.innerText()).toMatch(/Give an e-mail address or a phone number/);
    expect(await form.innerText()).toMatch(/Tick the box/);
    expect(await form.getByLabel("Your question").inputValue()).toBe("Can I see it on Saturday morning?");
    await form.getByLabel("Your name").fill("Pat Ellery");
    await form.getByLabel("Phone", { exact: true }).fill("07700 900456");
    await form.getByLabel(/Phone — We call you/).check();
    await form.getByRole("button", { name: /vehicle to trade in/ }).click();
    await form.getByLabel("Make").fill("Drovell");
    await form.getByLabel("Year").fill("2012");
    await form.getByLabel(/You may contact me about this vehicle/).check();
    await page.waitForTimeout(3200); // a person takes longer than MIN_FILL_MS; so does this test
    await screenshot(page, "enquiry-form-phone");
    await form.getByRole("button", { name: "Send my question" }).click();
    await expect.poll(() => page.getByText(/Your question is with us/).count()).toBe(1);
    expect(await page.getByRole("status").filter({ hasText: "Your question is with us" }).innerText()).toMatch(/Ambrel Loam[\s\S]*A salesperson will reply/);
    await screenshot(page, "enquiry-thank-you");
    const [rows] = await t.ctx.database.pool.query("select phone, preferred_contact as p from leads where name = 'Pat Ellery'");
    expect(rows).toEqual([{ phone: "07700 900456", p: "phone" }]);
    await page.getByRole("button", { name: "Send another question" }).click();
    expect(await page.getByLabel("Your name").inputValue()).toBe("Pat Ellery");
    expect(errors).toEqual([]);
    await page.close();
  });
});
