import { describe, expect, it } from "vitest";
import { e2eWorld } from "../support/e2e.ts";
import type { Page } from "playwright-core";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { imagesSettled, RESULTS_DIR, screenshot, watchErrors } from "../support/browser.ts";
import { publishReadyVehicle } from "../support/publishing.ts";

const world = e2eWorld();

/**
 * Staff code never reaches a buyer. The staff chunks are named after their modules: StaffShell, VehicleEditor,
 * VehicleLayout, and the staff routes users-, settings-, staff-overview-, vehicles- and vehicle-detail/-new/-photos/
 * -walkaround/-checks. "vehicle-" is matched at the start of the file name, because the public route's own chunk is
 * public-vehicle-….js.
 */
const isStaffChunk = (file: string) =>
  /StaffShell|VehicleEditor|VehicleLayout/.test(file) || /^(users-|settings-|vehicle-(detail|new|photos|walkaround|checks)-|vehicles-|staff-overview-|feeds-|leads-|lead-detail-|mail-outbox-)/.test(file);

function watchScripts(page: Page): string[] {
  const files: string[] = [];
  page.on("request", (r) => {
    if (r.resourceType() === "script") files.push(new URL(r.url()).pathname.split("/").pop() ?? "");
  });
  return files;
}

const noSideScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

/** Pages of a PDF Chromium printed (each page object is "/Type /Page", the tree "/Type /Pages"). */
const pdfPages = (pdf: Buffer) => (pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;

function savePdf(name: string, pdf: Buffer) {
  mkdirSync(RESULTS_DIR, { recursive: true });
  writeFileSync(path.join(RESULTS_DIR, `${name}.pdf`), pdf);
}

describe("a buyer on the public pages", () => {
  it("when a ready vehicle is published, then a buyer finds it by its model, reads its condition report, prints it and its window card, and no staff code loads", async () => {
    const { slug } = await publishReadyVehicle(world.t);
    const page = await world.browser.newPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 1 });
    const errors = watchErrors(page);
    const scripts = watchScripts(page);

    // The storefront: search by the model; the whole view is in the URL, so back and forward walk through it.
    await page.goto(`${world.url}/`);
    await expect.poll(() => page.getByRole("heading", { level: 1, name: "Vehicles for sale" }).count()).toBe(1);
    await page.getByLabel("Search by make, model or words in the listing").fill("Loam");
    await page.getByRole("button", { name: "Search", exact: true }).click();
    await page.waitForURL(/[?&]q=Loam/);
    const card = page.locator(`a[href="/vehicles/${slug}"]`);
    await expect.poll(() => card.count()).toBe(1);
    expect(await noSideScroll(page)).toBe(true);
    await screenshot(page, "storefront-phone");
    await page.goBack();
    await page.waitForURL(`${world.url}/`);
    await expect.poll(() => page.getByLabel("Search by make, model or words in the listing").inputValue()).toBe("");
    await page.goForward();
    await page.waitForURL(/[?&]q=Loam/);
    await expect.poll(() => page.getByLabel("Search by make, model or words in the listing").inputValue()).toBe("Loam");
    await expect.poll(() => card.count()).toBe(1);

    // The condition page.
    await card.click();
    await page.waitForURL(`${world.url}/vehicles/${slug}`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/Loam/);
    await expect.poll(() => page.title()).toMatch(/Loam.*—/);
    // 68 L at 8.8 L/100 km = 772.7 km, shown as 773 km (common practice, no source).
    const spec = page.getByRole("region", { name: "Specification" });
    await expect.poll(() => spec.innerText()).toMatch(/≈\s?773\s?km, theoretical, WLTP combined/);
    expect(await page.locator(".fr-keyfigures").innerText()).toMatch(/773\s?km/);

    // The defect map: numbered pins are buttons that pick their row in the list, which reads without the photos.
    const found = page.getByRole("region", { name: "What we found" });
    const pins = found.locator("button[aria-pressed]");
    await expect.poll(() => pins.count()).toBeGreaterThan(0);
    const firstPin = pins.first();
    expect(await firstPin.getAttribute("aria-label")).toMatch(/^\d+ (minor|moderate|major) /);
    const rowId = (await firstPin.getAttribute("aria-controls"))!;
    await firstPin.focus();
    await page.keyboard.press("Enter");
    await expect.poll(() => firstPin.getAttribute("aria-pressed")).toBe("true");
    await expect.poll(() => page.locator(`#${rowId}`).getAttribute("data-selected")).toBe("true");
    const lists = found.getByRole("list", { name: /^Items in / });
    await expect.poll(() => lists.count()).toBeGreaterThan(0);
    expect(await lists.first().innerText()).toMatch(/(Minor|Moderate|Major) .*\n?[\s\S]*Repair plan: (Repaired before sale|Disclosed as is|To be repaired)/);

    // The cautions of a responsible condition page (../shared/TRADE.md §8, 1 and 2).
    const about = page.getByRole("region", { name: "About this report" });
    expect(await about.innerText()).toMatch(/not a roadworthiness or safety certificate/);
    expect(await about.innerText()).toMatch(/inspected independently/);
    // The enquiry place holds the form and offers phone and e-mail with the stock number.
    const enquiry = page.getByRole("region", { name: "Ask about this vehicle" });
    // The enquiry form sits in the place kept for it (its own flow is tests/e2e/enquiries.test.ts); it loads after the
    // page has drawn (features/enquiries/EnquiryForm.tsx), so wait for it.
    await enquiry.locator("form").waitFor();
    expect(await enquiry.getByRole("button", { name: /send/i }).count()).toBeGreaterThan(0);
    expect(await enquiry.locator('a[href^="mailto:"][href*="subject="]').first().getAttribute("href")).toMatch(/subject=Stock%20number%20/);
    expect(await enquiry.locator("form").count()).toBe(1);

    // The gallery: only the first image loads eagerly; arrow keys move between photos.
    expect(await page.evaluate(() => [...document.images].filter((i) => i.loading === "eager").length)).toBe(1);
    const stage = page.getByRole("group", { name: /^Photo 1 of \d+/ });
    const photoCount = Number((await stage.getAttribute("aria-label"))!.match(/of (\d+)/)![1]);
    if (photoCount > 1) {
      await stage.focus();
      await page.keyboard.press("ArrowRight");
      await expect.poll(() => page.getByRole("group", { name: /^Photo 2 of / }).count()).toBe(1);
      await page.keyboard.press("ArrowLeft");
      await expect.poll(() => page.getByRole("group", { name: /^Photo 1 of / }).count()).toBe(1);
    }
    expect(await noSideScroll(page)).toBe(true);
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, "condition-phone");
    await page.setViewportSize({ width: 360, height: 780 });
    expect(await noSideScroll(page)).toBe(true);

    // Desktop, two columns.
    await page.setViewportSize({ width: 1366, height: 900 });
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, "condition-desktop");

    // Print: an A4 report of about two pages, without the gallery controls or the enquiry block. The screenshot is as
    // wide as the printed column: A4 less its 12 mm margins, 186 mm = 703 px at 96 px to the inch.
    await page.setViewportSize({ width: 703, height: 1000 });
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Next photo" }).isVisible()).toBe(false);
    expect(await enquiry.isVisible()).toBe(false);
    expect(await page.locator(".fr-print-footer").innerText()).toMatch(/\/vehicles\/.+ · Revision \d+, published /);
    // What the browser's print does first: every photo is asked for (they load lazily on screen).
    await page.evaluate(() => window.dispatchEvent(new Event("beforeprint")));
    await expect.poll(() => page.evaluate(() => [...document.images].every((i) => i.loading === "eager"))).toBe(true);
    await screenshot(page, "condition-print");
    const report = await page.pdf({ preferCSSPageSize: true, printBackground: false });
    savePdf("condition-print", report);
    expect(pdfPages(report)).toBeLessThanOrEqual(3);
    await page.emulateMedia({ media: "screen" });

    // The window card, from the page's own link.
    await page.getByRole("link", { name: "Window card" }).first().click();
    await page.waitForURL(`${world.url}/vehicles/${slug}/card`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/Loam/);
    const qr = page.getByRole("img", { name: /^QR code to the full condition report/ });
    expect(await qr.getAttribute("src")).toBe(`/api/public/vehicles/${slug}/qr.svg`);
    await imagesSettled(page);
    expect(await qr.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
    expect(await page.locator("main").innerText()).toMatch(/Scan for the full condition report/);
    expect(await page.locator("main").innerText()).toMatch(/773\s?km/);
    await page.setViewportSize({ width: 1000, height: 800 });
    await screenshot(page, "window-card");
    // A5 landscape, 210 × 148 mm = 794 × 559 px.
    await page.setViewportSize({ width: 794, height: 559 });
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print card" }).isVisible()).toBe(false);
    await screenshot(page, "window-card-print");
    const cardPdf = await page.pdf({ preferCSSPageSize: true });
    savePdf("window-card", cardPdf);
    expect(pdfPages(cardPdf)).toBe(1);

    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.filter(isStaffChunk)).toEqual([]);
    expect(errors).toEqual([]);
    await page.close();
  });

  it("when an address was never published, then the buyer gets a plain not-found page with a way to the stock", async () => {
    const page = await world.browser.newPage({ viewport: { width: 390, height: 844 } });
    const errors = watchErrors(page);
    await page.goto(`${world.url}/vehicles/never-published-here`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("We could not find this vehicle");
    expect(await page.getByRole("link", { name: "See the vehicles for sale" }).getAttribute("href")).toBe("/");
    // The 404 answer itself is logged by Chromium as a failed resource.
    expect(errors.filter((e) => !/status of 404/.test(e))).toEqual([]);
    await page.close();
  });
});
