/**
 * WCAG 2.1 AA as an accessibility engine sees it (axe-core in Chromium): every public page (the print view with
 * print media emulated) and every staff screen, at a phone's size and a desktop's, with no serious or critical
 * violation. Lesser findings are counted and printed, not failed: axe marks them as advice rather than barriers.
 */
import { describe, expect, it } from "vitest";
import { AxeBuilder } from "@axe-core/playwright";
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { e2eWorld } from "../support/e2e.ts";
import { ORIGIN } from "../support/app.ts";
import { screenshot } from "../support/browser.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { MIN_FILL_MS } from "../../shared/constants/leads.ts";

const world = e2eWorld();

const SIZES = { phone: { width: 390, height: 844 }, desktop: { width: 1280, height: 800 } } as const;
const TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"];
const BARRIERS = new Set(["serious", "critical"]);

type Finding = { page: string; size: string; rule: string; impact: string; help: string; targets: string[] };

interface Fixture {
  slug: string;
  vehicleId: number;
  leadId: number;
}

/** A published vehicle with two revisions (so an older one can be opened) and one buyer's enquiry in the inbox. */
async function prepare(): Promise<Fixture> {
  const { t } = world;
  const { slug, vehicleId, sales } = await publishReadyVehicle(t);
  const v = (await sales.get(`/api/vehicles/${vehicleId}`)).body.vehicle;
  expect((await sales.patch(`/api/vehicles/${vehicleId}`).send({ version: v.version, priceCents: 3_299_000 })).status).toBe(200);
  expect((await sales.post(`/api/vehicles/${vehicleId}/publish`).send({})).status).toBe(201);
  const enquiry = {
    name: "Jo Marlowe", email: "jo.marlowe@example.test", phone: "07700 900123", message: "Could I see it on Saturday?",
    preferredContact: "email", consent: true, website: "", startedAt: Date.now() - 20_000, revision: 2,
  };
  expect((await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry)).status).toBe(201);
  const [lead] = (await sales.get("/api/leads")).body.leads as { id: number }[];
  if (!lead) throw new Error("the enquiry made no lead");
  return { slug, vehicleId, leadId: lead.id };
}

/** Runs axe over what the page shows now and keeps every violation, named by page and size. */
async function check(page: Page, name: string, size: string, found: Finding[]) {
  const result = await new AxeBuilder({ page }).options({ resultTypes: ["violations"] }).withTags(TAGS).analyze();
  for (const v of result.violations) {
    found.push({ page: name, size, rule: v.id, impact: v.impact ?? "unknown", help: v.help, targets: v.nodes.slice(0, 3).map((n) => n.target.join(" ")) });
  }
}

/**
 * What an HTML validator warned of on the rendered condition page and axe does not check: a figcaption that is not
 * its figure's first or last child, aria-label on a list without a role, an input whose type is left to the default.
 */
const markupWarnings = (page: Page) =>
  page.evaluate(() => {
    const found: string[] = [];
    for (const c of document.querySelectorAll("figure > figcaption")) {
      const f = c.parentElement!;
      if (c !== f.firstElementChild && c !== f.lastElementChild) found.push("figcaption in the middle of its figure");
    }
    for (const l of document.querySelectorAll("ul[aria-label]:not([role]), ol[aria-label]:not([role])")) found.push(`aria-label on a plain list: ${l.getAttribute("aria-label")}`);
    for (const i of document.querySelectorAll("input:not([type])")) found.push(`input without type: ${i.getAttribute("name")}`);
    return found;
  });

/** Opens a page and waits until its data has arrived and its heading shows, so axe reads the page, not a spinner. */
async function open(page: Page, path: string) {
  await page.goto(`${world.url}${path}`);
  await page.locator("h1").first().waitFor();
  // Loading notices carry a spinner; a page still loading a part would be judged on its placeholder.
  await page.waitForFunction(() => !document.querySelector("[role=status] .animate-spin"));
}

async function checkSize(browser: Browser, f: Fixture, size: keyof typeof SIZES, found: Finding[]) {
  const context = await browser.newContext({ viewport: SIZES[size], isMobile: size === "phone", hasTouch: size === "phone" });
  const page = await context.newPage();
  let pages = 0;
  const visit = async (name: string, path: string, ready?: () => Promise<void>) => {
    await open(page, path);
    await ready?.();
    await check(page, name, size, found);
    pages++;
  };

  await visit("storefront", "/");
  await visit("window card", `/vehicles/${f.slug}/card`);
  // The condition page's enquiry form loads after the page has drawn: wait for it, so axe reads it too.
  const form = page.getByRole("form", { name: /Ask about the/ });
  await visit("old revision", `/vehicles/${f.slug}/revisions/1`, () => form.waitFor());
  await visit("condition page", `/vehicles/${f.slug}`, () => form.waitFor());
  const formShown = Date.now();
  expect(await markupWarnings(page)).toEqual([]);
  await screenshot(page, `accessibility/condition-page-${size}`);
  await page.emulateMedia({ media: "print" });
  await check(page, "print view", size, found);
  pages++;
  await page.emulateMedia({ media: "screen" });
  // The enquiry's sent state: the form filled as a buyer would, after the form's minimum fill time.
  await form.getByLabel("Your name").fill("Sam Oakes");
  await form.getByLabel("E-mail", { exact: true }).fill("sam.oakes@example.test");
  await form.getByLabel("Your question").fill("Is the spare wheel full size?");
  await form.getByLabel(/You may contact me about this vehicle/).check();
  await page.waitForTimeout(Math.max(0, formShown + MIN_FILL_MS + 200 - Date.now()));
  await form.getByRole("button", { name: "Send my question" }).click();
  await page.getByText(/Your question is with us/).waitFor();
  await check(page, "enquiry sent", size, found);
  pages++;

  await visit("sign-in", "/sign-in");
  await screenshot(page, `accessibility/sign-in-${size}`);
  await world.signIn(page, "admin@demo.test");
  const staff: [string, string][] = [
    ["overview", "/app"], ["stock list", "/app/vehicles"], ["vehicle record", `/app/vehicles/${f.vehicleId}`],
    ["photos", `/app/vehicles/${f.vehicleId}/photos`], ["walk-around", `/app/vehicles/${f.vehicleId}/walkaround`],
    ["checks", `/app/vehicles/${f.vehicleId}/checks`], ["enquiries", "/app/leads"], ["lead", `/app/leads/${f.leadId}`],
    ["feeds", "/app/feeds"], ["staff", "/app/users"], ["settings", "/app/settings"], ["mail", "/app/mail"],
  ];
  for (const [name, path] of staff) await visit(name, path);
  await context.close();
  return pages;
}

describe("accessibility (axe-core, WCAG 2.1 AA)", () => {
  it("when every public page and staff screen is checked at phone and desktop sizes, then axe finds no serious or critical violation", async () => {
    const f = await prepare();
    const found: Finding[] = [];
    let checked = 0;
    for (const size of Object.keys(SIZES) as (keyof typeof SIZES)[]) checked += await checkSize(world.browser, f, size, found);

    const byImpact: Record<string, number> = {};
    for (const v of found) byImpact[v.impact] = (byImpact[v.impact] ?? 0) + 1;
    console.log(`axe: ${checked} page × size checks (${checked / 2} pages × 2 sizes), violations by impact: ${JSON.stringify(byImpact)}`);
    for (const v of found) console.log(`axe: ${v.impact} ${v.rule} on ${v.page} (${v.size}): ${v.help} · ${v.targets.join(" | ")}`);
    expect(found.filter((v) => BARRIERS.has(v.impact)).map((v) => `${v.rule} on ${v.page} (${v.size})`)).toEqual([]);
  }, 180_000);
});
