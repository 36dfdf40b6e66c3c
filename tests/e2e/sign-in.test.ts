import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync } from "node:fs";
import path from "node:path";
import type { Browser } from "playwright-core";
import { DEMO_PASSWORD, startTestApp, type TestApp } from "../support/app.ts";
import { launchBrowser, screenshot, watchErrors } from "../support/browser.ts";
import { listen } from "../support/http-server.ts";
import { DEMO_USERS } from "../../server/demo/demo.ts";

let t: TestApp;
let browser: Browser;
let server: Awaited<ReturnType<typeof listen>>;

beforeAll(async () => {
  if (!existsSync(path.resolve("dist/client/index.html"))) throw new Error("Build the client first (npm test does it).");
  t = await startTestApp();
  server = await listen(t.app);
  // The app's allowed origin is the test server's own; the Origin check also accepts the request's Host.
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
  await t?.close();
});

const expectedNav = {
  admin: ["Overview", "Stock", "Enquiries", "Feeds", "Staff", "Dealership", "Mail"],
  sales: ["Overview", "Stock", "Enquiries"],
  workshop: ["Overview", "Stock"],
  marketing: ["Overview", "Stock", "Enquiries", "Feeds"],
} as const;

describe("signing in as each role in Chromium", () => {
  it.each(DEMO_USERS.map((u) => [u.role, u.email] as const))("when %s signs in, then the staff area shows that role's navigation, and sign-out returns to sign-in", async (role, email) => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    const errors = watchErrors(page);
    await page.goto(`${server.url}/app`);
    await page.waitForURL(/\/sign-in\?next=%2Fapp/);
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await screenshot(page, `foundation-sign-in-${role}`);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${server.url}/app`);
    const nav = page.getByRole("navigation", { name: "Staff" });
    await expect.poll(() => nav.getByRole("link").allInnerTexts()).toEqual(expectedNav[role]);
    await screenshot(page, `foundation-overview-${role}`);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    expect(errors).toEqual([]);
    await page.close();
  });

  it("when the password is wrong, then the form says so and keeps the e-mail typed", async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel("E-mail").fill("sales@demo.test");
    await page.getByLabel("Password").fill("not the right one");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect.poll(() => page.getByRole("alert").first().innerText()).toMatch(/do not match/);
    expect(await page.getByLabel("E-mail").inputValue()).toBe("sales@demo.test");
    await screenshot(page, "foundation-sign-in-error");
    await page.close();
  });

  it("when the public front page opens, then it loads no staff code", async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const scripts: string[] = [];
    page.on("request", (r) => {
      if (r.resourceType() === "script") scripts.push(new URL(r.url()).pathname);
    });
    await page.goto(server.url, { waitUntil: "networkidle" });
    await expect.poll(() => page.getByRole("banner").innerText()).toMatch(/Fernhollow Motors/);
    expect(scripts.some((s) => /StaffShell|users-|settings-/.test(s))).toBe(false);
    await screenshot(page, "foundation-storefront-phone");
    await page.close();
  });
});
