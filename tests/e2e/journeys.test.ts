/**
 * One working day at Fernhollow Motors, one journey per role, in Chromium against the app as wired. The tests run in
 * order and hand the vehicle on: the workshop records its evidence, sales completes and publishes it, a buyer enquires
 * on a phone, sales answers, marketing feeds it to a portal, and the admin invites a colleague and publishes another
 * vehicle over its block. Every step leaves a screenshot in test-results/screenshots/journeys/<role>-<nn>-<step>.png
 * (scripts/screenshots.ts picks the ones for docs/screenshots/).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Locator, Page } from "playwright-core";
import sharp from "sharp";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { create as parseXml } from "xmlbuilder2";
import { e2eWorld } from "../support/e2e.ts";
import { imagesSettled, RESULTS_DIR, screenshot, watchErrors } from "../support/browser.ts";
import { catchMail } from "../support/mail.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { renderDemoPhoto, type Angle } from "../../server/demo/art/index.ts";
import { computeCheckDigit } from "../../shared/domain/vin.ts";
import { ZONES } from "../../shared/constants/evidence.ts";
import { MIN_FILL_MS } from "../../shared/constants/leads.ts";

const world = e2eWorld();
let mail: Awaited<ReturnType<typeof catchMail>>;

// Everyone is where the demo dealership is (server/demo/demo.ts: en-AU, Australia/Brisbane), so staff dates read
// as they would at Fernhollow Motors.
const WHERE = { locale: "en-AU", timezoneId: "Australia/Brisbane" };
// A phone held in one hand on the yard or on the sofa (390 × 844 CSS px, common practice, no source).
const PHONE = { ...WHERE, viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
const DESK = { ...WHERE, viewport: { width: 1366, height: 900 }, deviceScaleFactor: 1 };

/** "Z9A" is the demo's invented maker prefix for Ambrel (server/demo/demo-vehicles.ts); position 9 is computed. */
function demoVin(): string {
  const draft = "Z9ALM7D80TK204118";
  return draft.slice(0, 8) + computeCheckDigit(draft)! + draft.slice(9);
}
const VIN = demoVin();
const PLATE = "FHM 318";
const TITLE = "2019 Ambrel Loam";
const BUYER = { name: "Tamsin Vey", email: "tamsin.vey@example.test" };

/** The journey's vehicle, as handed from one role to the next. */
const car = { id: 0, slug: "", stockNumber: "" };

beforeAll(async () => {
  mail = await catchMail(world.t);
  // Set-up only: sales has taken the vehicle in through the API without a price or copy (the stock-entry form is
  // driven in tests/e2e/vehicles.test.ts). Everything after this happens in the browser.
  const sales = await world.t.signIn("sales");
  const { priceCents: _p, description: _d, ...intake } = dieselSuv({ vin: VIN, registrationPlate: PLATE });
  const res = await sales.post("/api/vehicles").send(intake);
  expect(res.status).toBe(201);
  car.id = res.body.vehicle.id;
  car.stockNumber = res.body.vehicle.stockNumber;
  mkdirSync(path.join(RESULTS_DIR, "journeys"), { recursive: true });
}, 60_000);
afterAll(async () => {
  await mail?.close();
});

/** Steps so far per role, across that role's tests and pages. */
const steps = new Map<string, number>();

/**
 * A page for one role: every step is numbered into its screenshot's name, and the page must run clean: no uncaught
 * error, no console error, no request that failed or was answered 4xx/5xx.
 */
function rolePage(role: string, page: Page) {
  const errors = watchErrors(page);
  page.on("requestfailed", (r) => errors.push(`request failed: ${r.method()} ${r.url()} ${r.failure()?.errorText ?? ""}`));
  page.on("response", (r) => {
    if (r.status() >= 400) errors.push(`${r.status()} ${r.request().method()} ${r.url()}`);
  });
  page.setDefaultTimeout(15_000); // a missing element fails with its name, well inside the test's time
  return {
    page,
    errors,
    /** The whole page; or what the screen shows; or one part of it (a panel far down a long page). */
    async shot(name: string, part?: Locator | "screen") {
      const step = (steps.get(role) ?? 0) + 1;
      steps.set(role, step);
      const file = `journeys/${role}-${String(step).padStart(2, "0")}-${name}`;
      if (!part) return screenshot(page, file);
      if (part !== "screen") await part.scrollIntoViewIfNeeded();
      await imagesSettled(page);
      const target = path.join(RESULTS_DIR, `${file}.png`);
      await (part === "screen" ? page.screenshot({ path: target }) : part.screenshot({ path: target }));
    },
    /** Asserts the page ran clean so far. */
    clean() {
      expect(errors).toEqual([]);
    },
    async close() {
      await page.context().close();
    },
  };
}

async function open(role: string, options: typeof PHONE | typeof DESK) {
  const page = await world.browser.newPage(options);
  return rolePage(role, page);
}

const staffNav = (page: Page, name: string) => page.getByRole("navigation", { name: "Staff" }).getByRole("link", { name, exact: true });
const vehicleTab = (page: Page, name: RegExp) => page.getByRole("navigation", { name: "Vehicle sections" }).getByRole("link", { name });

/** A yard photo as a phone would send it: drawn by the project's demo art, sent at 1200 px. */
async function yardPhoto(angle: Angle, i: number) {
  return {
    name: `IMG_20${41 + i}.jpg`,
    mimeType: "image/jpeg",
    buffer: await sharp(await renderDemoPhoto({ bodyType: "suv", colour: "Slate grey", angle, seed: 70 + i })).resize(1200).jpeg({ quality: 82 }).toBuffer(),
  };
}

describe("journeys, one per role", () => {
  it("when the workshop prepares the vehicle on a phone, then the photos, two pinned defects with close-ups, every zone, the tyres and the checks are recorded", async () => {
    const w = await open("workshop", PHONE);
    const { page } = w;
    await world.signIn(page, "workshop@demo.test");
    await w.shot("signed-in");

    // Find the vehicle by its plate, as read off the car.
    await staffNav(page, "Stock").click();
    await page.getByLabel("Search stock").fill(PLATE);
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/q=FHM/);
    const link = page.getByRole("link", { name: car.stockNumber });
    await expect.poll(() => link.count()).toBe(1);
    await w.shot("stock-search");
    await link.click();
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/2019 Ambrel Loam/);
    await page.getByRole("button", { name: "Start preparing" }).click();
    await expect.poll(() => page.locator("main header").getByText("Preparing", { exact: true }).count()).toBe(1);
    await w.shot("preparing");

    // Photos through the real file inputs: two taken with the camera walking round, two chosen from the phone's photos.
    await vehicleTab(page, /^Photos/).click();
    const pick = async (button: string, files: Awaited<ReturnType<typeof yardPhoto>>[]) => {
      const [chooser] = await Promise.all([page.waitForEvent("filechooser"), page.getByRole("button", { name: button }).click()]);
      await chooser.setFiles(files);
    };
    await pick("Take a photo", [await yardPhoto("front_left", 0)]);
    await expect.poll(() => page.getByTestId("photo-card").count(), { timeout: 30_000 }).toBe(1);
    await pick("Take a photo", [await yardPhoto("side_left", 1)]);
    await expect.poll(() => page.getByTestId("photo-card").count(), { timeout: 30_000 }).toBe(2);
    await pick("Choose photos", [await yardPhoto("rear_right", 2), await yardPhoto("interior_front", 3)]);
    await expect.poll(() => page.locator('[data-state="done"]').count(), { timeout: 30_000 }).toBe(2);
    await expect.poll(() => page.getByTestId("photo-card").count()).toBe(4);
    // The first photo became the cover; the two exterior views are filed under their zones.
    const cards = page.getByTestId("photo-card");
    expect(await cards.first().innerText()).toMatch(/Cover/);
    await cards.nth(0).getByLabel("Zone").selectOption("front");
    await expect.poll(() => cards.nth(0).getByLabel("Zone").inputValue()).toBe("front");
    await cards.nth(1).getByLabel("Zone").selectOption("left_side");
    await expect.poll(() => cards.nth(1).getByLabel("Zone").inputValue()).toBe("left_side");
    await expect.poll(() => page.getByText("Processing sizes…").count(), { timeout: 60_000 }).toBe(0);
    await page.evaluate(() => window.scrollTo(0, 0));
    await w.shot("photos");

    // The walk-around: a dent pinned on the left-side photo, a stone chip on the front, the rest nothing found.
    await vehicleTab(page, /^Walk-around/).click();
    const photo = page.getByTestId("pinnable-photo");
    async function pinDefect(zone: RegExp, at: { x: number; y: number }, d: { kind: string; severity: string; size: string; note: string; plan: string }) {
      await page.getByRole("button", { name: zone }).click();
      // The zone's own photo comes first in the strip.
      await page.getByRole("group", { name: "Choose the photo to pin on" }).getByRole("button").first().click();
      await page.getByRole("button", { name: "Place the pin" }).click();
      const box = (await photo.boundingBox())!;
      await photo.tap({ position: { x: box.width * at.x, y: box.height * at.y } });
      await page.getByLabel("Kind").selectOption(d.kind);
      await page.getByText(d.severity, { exact: true }).click();
      await page.getByLabel("Longest size").fill(d.size);
      await page.getByLabel("Repair plan").selectOption(d.plan);
      await page.getByLabel("Note", { exact: true }).fill(d.note);
      await page.getByRole("button", { name: /^Record a defect/ }).click();
    }
    await pinDefect(/^Left side/, { x: 0.55, y: 0.55 }, { kind: "dent", severity: "Moderate", size: "22", note: "Rear door, below the handle", plan: "disclosed_as_is" });
    await expect.poll(() => page.getByText("Defect 1 recorded and pinned.").count()).toBe(1);
    await expect.poll(() => page.getByAltText("Close-up of defect 1").evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0)).toBe(true);
    await w.shot("walkaround-pinned", page.getByRole("region", { name: "Left side", exact: true }));
    await pinDefect(/^Front\b/, { x: 0.24, y: 0.56 }, { kind: "stone_chip", severity: "Minor", size: "3", note: "Bonnet leading edge, paint only", plan: "repaired_before_sale" });
    await expect.poll(() => page.getByText("Defect 2 recorded and pinned.").count()).toBe(1);
    expect(await page.getByRole("list", { name: "Defects in Front" }).innerText()).toMatch(/Minor stone chip, 3 mm/);
    await expect.poll(() => page.getByAltText("Close-up of defect 2").evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0)).toBe(true);
    await w.shot("walkaround-second-pin", page.getByRole("region", { name: "Front", exact: true }));
    await page.getByRole("button", { name: "Next zone →" }).click();
    // "Nothing found here" moves on to the next zone still to check, as a person walks round the car.
    for (let left = ZONES.length - 2; left > 0; left--) {
      await expect.poll(() => page.getByText(`${left} of ${ZONES.length} zones still to check.`).count()).toBe(1);
      await page.getByRole("button", { name: "Nothing found here" }).click();
    }
    await expect.poll(() => page.getByText("Every zone has been checked.").count()).toBe(1);
    await page.evaluate(() => window.scrollTo(0, 0));
    await w.shot("walkaround-done");

    // Tyres and checks. One tyre is old enough to advise on.
    await vehicleTab(page, /^Tyres and checks/).click();
    const tyre = (name: string) => page.getByRole("region", { name, exact: true });
    const fillTyre = async (name: string, tread: [string, string, string], dot: string, size?: string) => {
      const card = tyre(name);
      await card.getByLabel(`${name} inner tread`).fill(tread[0]);
      await card.getByLabel(`${name} centre tread`).fill(tread[1]);
      await card.getByLabel(`${name} outer tread`).fill(tread[2]);
      if (size) await card.getByLabel(`${name} size`).fill(size);
      else await card.getByRole("button", { name: "Same as front left" }).click();
      await card.getByLabel(`${name} DOT date code`).fill(dot);
      await card.getByLabel(`${name} pressure`).fill("240");
    };
    await fillTyre("Front left", ["5.1", "5.4", "5.2"], "2324", "235/60 R18 103V");
    await fillTyre("Front right", ["5.0", "5.3", "5.1"], "2324");
    await fillTyre("Rear left", ["6.0", "6.2", "6.1"], "2324");
    // DOT 0918: week 9 of 2018, measured today (the test machine's clock, 2026 or later) → 8 years or more, which
    // calls for an advisory at 6 years (../shared/TRADE.md §2.4, S [S5]; §2.6, CP).
    await fillTyre("Rear right", ["6.1", "6.3", "6.0"], "0918");
    const checkRow = (name: RegExp) => page.getByRole("group", { name });
    for (const item of [/^Brakes/, /^Lights/, /^Warning lamps/, /^Seat belts/]) await checkRow(item).getByRole("radio", { name: "Pass" }).check();
    await checkRow(/^Heating and air conditioning/).getByRole("radio", { name: "Advise" }).check();
    await checkRow(/^Heating and air conditioning/).getByLabel(/what you found/i).fill("Slow to cool; regassed before sale");
    await page.getByRole("button", { name: "Save tyres and checks" }).click();
    await expect.poll(() => page.getByTestId("save-status").innerText()).toBe("Saved the tyre readings and the checks.");
    const cautions = await page.getByRole("region", { name: "Cautions" }).innerText();
    expect(cautions).toMatch(/advis/i);
    expect(cautions).not.toMatch(/Publishing is blocked/);
    await page.evaluate(() => window.scrollTo(0, 0));
    await w.shot("tyres-checks-saved");
    w.clean();
    await w.close();
  }, 150_000);

  it("when sales completes the record, then readiness turns every item done and publishing makes revision 1 live", async () => {
    const s = await open("sales", DESK);
    const { page } = s;
    await world.signIn(page, "sales@demo.test");
    await staffNav(page, "Stock").click();
    await expect.poll(() => page.locator("tbody tr").count()).toBeGreaterThan(10);
    await s.shot("stock-list");
    await page.getByLabel("Search stock").fill(VIN);
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(new RegExp(`q=${VIN}`));
    await page.getByRole("link", { name: car.stockNumber }).click();
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/2019 Ambrel Loam/);

    // Readiness names what is missing, with links to where it is done.
    const readiness = page.getByRole("list", { name: "Readiness" });
    await expect.poll(() => readiness.innerText()).toMatch(/Missing:\s*A price/);
    expect(await readiness.innerText()).toMatch(/Missing:\s*Listing copy/);
    expect(await readiness.innerText()).toMatch(/Done:\s*Every zone of the walk-around checked/);
    await s.shot("readiness-missing", page.getByRole("region", { name: "Publishing" }));

    await page.getByRole("textbox", { name: "Price", exact: true }).fill("34990");
    await page.getByRole("textbox", { name: "Listing copy", exact: true }).fill(
      "One owner from new, serviced on time at the same workshop.\n\n- Seven seats, the third row folds flat\n- Tow bar rated for a braked trailer\n\n**Full service history** in the books.",
    );
    await page.getByRole("button", { name: "Preview" }).click();
    await expect.poll(() => page.locator(".prose-copy strong").innerText()).toBe("Full service history");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => page.getByText("All changes saved").count()).toBe(1);
    await expect.poll(() => readiness.innerText()).not.toMatch(/Missing:/);
    const publishing = page.getByRole("region", { name: "Publishing" });
    await s.shot("ready", publishing);

    await publishing.getByRole("button", { name: "Publish", exact: true }).click();
    await expect.poll(() => publishing.getByText("Revision 1 is live.").count()).toBe(1);
    await expect.poll(() => page.locator("header").getByText("Live", { exact: true }).count()).toBe(1);
    const href = (await publishing.getByRole("link", { name: "Public page" }).getAttribute("href"))!;
    car.slug = new URL(href).pathname.split("/").at(-1)!;
    expect(car.slug).toMatch(/loam/);
    await s.shot("published", publishing);
    s.clean();
    await s.close();
  }, 90_000);

  it("when a buyer on a phone finds the car, then the condition page shows its photos, pins, tyres and cautions, and the enquiry goes through", async () => {
    expect(car.slug).not.toBe("");
    const b = await open("buyer", PHONE);
    const { page } = b;
    await page.goto(`${world.url}/`);
    await expect.poll(() => page.getByRole("heading", { level: 1, name: "Vehicles for sale" }).count()).toBe(1);
    await page.getByLabel("Search by make, model or words in the listing").fill("Loam");
    await page.getByRole("button", { name: "Search", exact: true }).click();
    await page.waitForURL(/[?&]q=Loam/);
    const card = page.locator(`a[href="/vehicles/${car.slug}"]`);
    await expect.poll(() => card.count()).toBe(1);
    await b.shot("storefront");
    await card.tap();
    await page.waitForURL(`${world.url}/vehicles/${car.slug}`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/Loam/);
    await b.shot("condition-page", "screen");
    await b.shot("condition-page-whole");

    // Gallery: four photos, swiped on by the arrow button.
    const stage = page.getByRole("group", { name: /^Photo 1 of 4/ });
    await expect.poll(() => stage.count()).toBe(1);
    await page.getByRole("button", { name: "Next photo" }).tap();
    await expect.poll(() => page.getByRole("group", { name: /^Photo 2 of 4/ }).count()).toBe(1);

    // The defect map: the tapped pin picks its row, which has the close-up.
    const found = page.getByRole("region", { name: "What we found" });
    const pins = found.locator("button[aria-pressed]");
    await expect.poll(() => pins.count()).toBe(2);
    const dent = found.getByRole("button", { name: /^1 moderate dent/ });
    await dent.scrollIntoViewIfNeeded();
    await dent.tap();
    await expect.poll(() => dent.getAttribute("aria-pressed")).toBe("true");
    const row = page.locator(`#${(await dent.getAttribute("aria-controls"))!}`);
    await expect.poll(() => row.getAttribute("data-selected")).toBe("true");
    expect(await found.innerText()).toMatch(/Stone chip[\s\S]*Repair plan: Repaired before sale/i);
    await expect.poll(() => found.getByAltText(/^Close-up of item 1/).evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0)).toBe(true);
    await b.shot("defect-map", found);

    const tyres = page.getByRole("region", { name: "Tyres and checks" });
    // The legal minimum where the demo sells: 1.5 mm, WA Road Traffic (Vehicles) Regulations 2014 r 270(2), ../shared/TRADE.md §2.5 (S [S9]).
    expect(await tyres.innerText()).toMatch(/legal minimum tread depth where we sell is 1\.5\s?mm/);
    expect(await tyres.innerText()).toMatch(/Heating and air conditioning[\s\S]*Slow to cool/);
    await b.shot("tyres-checks", tyres);
    const cautions = page.getByRole("region", { name: "Cautions" });
    expect(await cautions.innerText()).toMatch(/Advisory:.*Rear right tyre/);
    expect(await cautions.innerText()).not.toMatch(/Safety:/);
    await b.shot("cautions", cautions);

    const form = page.getByRole("form", { name: /Ask about the/ });
    await form.scrollIntoViewIfNeeded();
    await form.getByLabel("Your name").fill(BUYER.name);
    await form.getByLabel("E-mail", { exact: true }).fill(BUYER.email);
    await form.getByLabel("Your question").fill("Is the tow bar rated for a 2-tonne caravan? Could I see it on Saturday?");
    await form.getByLabel(/You may contact me about this vehicle/).check();
    await page.waitForTimeout(MIN_FILL_MS + 200); // a person takes longer than the form's minimum fill time; so does this test
    await b.shot("enquiry-filled", form);
    await form.getByRole("button", { name: "Send my question" }).tap();
    await expect.poll(() => page.getByText(/Your question is with us/).count()).toBe(1);
    await b.shot("enquiry-sent", "screen");
    b.clean();
    await b.close();
  }, 90_000);

  it("when sales opens the buyer's enquiry, then the reply goes out by e-mail and the lead moves on", async () => {
    const s = await open("sales", DESK);
    const { page } = s;
    await world.signIn(page, "sales@demo.test");
    await staffNav(page, "Enquiries").click();
    const row = page.locator("tbody tr", { hasText: BUYER.name });
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.innerText()).toMatch(/Waiting for a reply/);
    expect(await row.innerText()).toMatch(new RegExp(TITLE));
    await s.shot("enquiries");
    await page.getByRole("link", { name: BUYER.name }).click();
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe(BUYER.name);
    expect(await page.getByRole("link", { name: /revision 1 of the condition page/ }).getAttribute("href")).toBe(`/vehicles/${car.slug}/revisions/1`);
    await page.getByLabel(`Your reply to ${BUYER.name}`).fill("Yes, rated to 2,500 kg braked. Saturday at 10 suits us; the car will be at the front of the yard.");
    await page.getByRole("button", { name: "Send reply by e-mail" }).click();
    await expect.poll(() => page.getByText("Reply queued").count()).toBe(1);
    await expect.poll(() => page.getByLabel("Status").inputValue()).toBe("talking");
    await mail.captured();
    const conversation = page.getByRole("list", { name: "Conversation, oldest first" });
    await expect.poll(() => conversation.innerText(), { timeout: 15_000 }).toMatch(/E-mail to the buyer[\s\S]*Sent/);
    await page.getByLabel("Status").selectOption("test_drive");
    await page.getByLabel("Add a note").fill("Test drive Saturday 10:00.");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => page.getByText("Saved.").count()).toBe(1);
    await expect.poll(() => conversation.innerText()).toMatch(/In conversation → Test drive booked/);
    await s.shot("lead-answered");
    const sent = (await mail.captured()).filter((m) => m.to.includes(BUYER.email));
    expect(sent.some((m) => /2,500 kg braked/.test(m.text))).toBe(true);
    s.clean();
    await s.close();
  }, 60_000);

  it("when marketing creates an XML feed, then a portal's fetch parses to the vehicle and the fetch shows in the log", async () => {
    const m = await open("marketing", DESK);
    const { page } = m;
    await world.signIn(page, "marketing@demo.test");
    await staffNav(page, "Feeds").click();
    await page.getByRole("heading", { name: "Feeds", level: 1 }).waitFor();
    const form = page.getByRole("form", { name: "Create a feed" });
    await form.getByLabel("Name").fill("Eastern Downs listings portal");
    await form.getByLabel("Format").selectOption("xml");
    await form.getByLabel("Makes").fill("Ambrel");
    await form.getByRole("button", { name: "Preview the first rows" }).click();
    const preview = page.getByRole("table", { name: "Preview of the first rows" });
    await expect.poll(() => preview.innerText()).toContain(car.stockNumber);
    await m.shot("feed-preview");
    await form.getByRole("button", { name: "Save the feed" }).click();
    await page.getByText("Save this URL now: it will not be shown again").waitFor();
    const url = (await page.getByTestId("secret-url").textContent())!.trim();
    expect(url).toMatch(/\/feeds\/[A-Za-z0-9_-]{43}\.xml$/);
    await m.shot("feed-secret-url");
    await page.getByRole("button", { name: "I have saved it" }).click();

    // The portal fetches it over HTTP and parses the XML.
    const res = await fetch(`${world.url}${new URL(url).pathname}`, { headers: { "User-Agent": "EasternDownsPortal/2.1" } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^application\/xml/);
    const doc = parseXml(await res.text()).end({ format: "object" }) as { vehicles: { vehicle: Record<string, unknown> | Array<Record<string, unknown>> } };
    const vehicles = [doc.vehicles.vehicle].flat();
    const ours = vehicles.find((v) => v.stockNumber === car.stockNumber);
    expect(ours).toBeDefined();
    expect(ours).toMatchObject({ make: "Ambrel", model: "Loam", buildYear: "2019", price: "34990.00" });
    expect(vehicles.every((v) => v.make === "Ambrel")).toBe(true);

    // The fetch is logged once its answer has gone (feeds.public.routes.ts), so the page may need a reload or two.
    const feed = page.getByRole("article", { name: "Feed Eastern Downs listings portal" });
    await expect
      .poll(async () => {
        await page.reload();
        await feed.waitFor();
        return feed.getByText("Last fetched just now.").count();
      })
      .toBe(1);
    expect(await feed.getByRole("table", { name: "Fetches of Eastern Downs listings portal" }).textContent()).toContain("EasternDownsPortal/2.1");
    await m.shot("feed-fetched");
    m.clean();
    await m.close();
  }, 60_000);

  it("when the admin invites a colleague, then the invitation mail's link lets them choose a password and sign in", async () => {
    const a = await open("admin", DESK);
    const { page } = a;
    await world.signIn(page, "admin@demo.test");
    await staffNav(page, "Staff").click();
    const invite = page.getByRole("form", { name: "Invite a staff member" });
    await invite.getByLabel("Name").fill("Orla Penhale");
    await invite.getByLabel("E-mail").fill("orla.penhale@demo.test");
    await invite.getByLabel("Role").selectOption("workshop");
    await invite.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => invite.getByText("Invitation sent").count()).toBe(1);
    await a.shot("invited");
    const letter = (await mail.captured()).find((m) => m.to.includes("orla.penhale@demo.test"));
    expect(letter).toBeDefined();
    const link = letter!.text.match(/https?:\/\/\S+\/accept-invite\?token=[A-Za-z0-9_-]+/)![0];
    a.clean();
    await a.close();

    // The colleague, on their own phone, follows the link from the mail (its host is the configured PUBLIC_URL).
    const o = await open("admin", PHONE);
    await o.page.goto(`${world.url}${new URL(link).pathname}${new URL(link).search}`);
    await expect.poll(() => o.page.getByRole("heading", { level: 1 }).innerText()).toBe("Welcome, Orla Penhale");
    await o.page.getByLabel("New password").fill("slate roof over the paint booth");
    await o.page.getByLabel("The same password again").fill("slate roof over the paint booth");
    await o.shot("invitee-password");
    await o.page.getByRole("button", { name: "Create my account" }).click();
    await o.page.waitForURL(`${world.url}/app`);
    await o.page.getByRole("button", { name: "Sign out" }).click();
    await o.page.waitForURL(/\/sign-in/);
    await o.page.getByLabel("E-mail").fill("orla.penhale@demo.test");
    await o.page.getByLabel("Password").fill("slate roof over the paint booth");
    await o.page.getByRole("button", { name: "Sign in" }).click();
    await o.page.waitForURL(`${world.url}/app`);
    await expect.poll(() => o.page.getByText("Orla Penhale · Workshop").count()).toBe(1);
    await o.shot("invitee-signed-in");
    o.clean();
    await o.close();
  }, 60_000);

  it("when the admin publishes a blocked vehicle over its block, then the reason is on the revision and in the history", async () => {
    const a = await open("admin", DESK);
    const { page } = a;
    await world.signIn(page, "admin@demo.test");
    await staffNav(page, "Stock").click();
    await page.getByLabel("Status").selectOption("preparing");
    await page.waitForURL(/status=preparing/);
    await expect.poll(() => page.locator("tbody tr").count()).toBeGreaterThan(1);
    // A demo vehicle in preparation other than the journey's: test databases have no demo photos, so it is blocked.
    const other = page.locator("tbody tr").filter({ hasNotText: car.stockNumber }).first().getByRole("link").first();
    await other.click();
    await page.waitForURL(/\/app\/vehicles\/\d+$/);
    const publishing = page.getByRole("region", { name: "Publishing" });
    await expect.poll(() => publishing.getByRole("list", { name: "Readiness" }).innerText()).toMatch(/Missing:\s*At least 4 photos/);
    const reason = "Trade sale to the Eastern Downs auction: sold as inspected on the day, photos taken by the buyer's agent.";
    await publishing.getByLabel("Publish over the block (admin)").fill(reason);
    await a.shot("override-reason", publishing);
    await publishing.getByRole("button", { name: "Publish with this reason" }).click();
    await expect.poll(() => publishing.getByText(/is live, published over the block/).count()).toBe(1);
    expect(await publishing.innerText()).toContain(`Published over the block: ${reason}`);
    await a.shot("override-published", publishing);

    const history = page.getByRole("region", { name: "History", exact: true });
    await expect.poll(() => history.innerText()).toContain(`Published over a block: ${reason}`);
    expect(await history.innerText()).toMatch(/published with override/);
    expect(await history.innerText()).toContain(reason);
    await a.shot("override-history", history);
    a.clean();
    await a.close();
  }, 60_000);
});
