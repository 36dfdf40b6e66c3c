import { e2eWorld } from "../support/e2e.ts";
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { screenshot, watchErrors } from "../support/browser.ts";

const world = e2eWorld();

const signIn = (page: Page, email: string) => world.signIn(page, email);

const figure = (page: Page, label: string) => page.locator("dt", { hasText: label }).locator("xpath=following-sibling::dd[1]");

describe("stock entry in Chromium", () => {
  it("when sales enters a vehicle, then range and economy appear as the fields are filled, and the saved vehicle is found by VIN", async () => {
    const page = await world.browser.newPage({ viewport: { width: 1366, height: 900 } });
    const errors = watchErrors(page);
    await signIn(page, "sales@demo.test");
    await page.getByRole("navigation", { name: "Staff" }).getByRole("link", { name: "Stock", exact: true }).click();
    await page.getByRole("link", { name: "Add a vehicle" }).click();
    await page.getByLabel("VIN").fill("1g4ah59h45g118341");
    await page.getByLabel("Make").fill("Ambrel");
    await page.getByLabel("Model", { exact: true }).fill("Loam");
    await page.getByLabel("Build year").fill("2019");
    await page.getByLabel("Fuel", { exact: true }).selectOption("diesel");
    await expect.poll(() => figure(page, "Theoretical range").innerText()).toMatch(/needs inputs/);
    await page.getByLabel("Fuel tank").fill("68");
    await page.getByLabel("Fuel consumption").fill("8.8");
    await page.getByLabel("Consumption measured on").selectOption("wltp");
    // 68 L at 8.8 L/100 km = 772.7 km, shown as 773 km (common practice, no source).
    await expect.poll(() => figure(page, "Theoretical range").innerText()).toMatch(/^≈\s?773\s?km$/);
    // 235.214583 / 8.8 = 26.7 mpg US; 282.480936 / 8.8 = 32.1 mpg UK (../shared/TRADE.md §3).
    await expect.poll(() => figure(page, "Economy").innerText()).toMatch(/26\.7.*32\.1/);
    await expect.poll(() => figure(page, "VIN check").innerText()).toBe("Check digit correct");
    await page.getByLabel("Power").fill("147");
    await page.getByLabel("Odometer as read").fill("84210");
    await screenshot(page, "vehicles-editor-live-figures");
    await page.getByRole("button", { name: "Add to stock" }).click();
    await page.waitForURL(/\/app\/vehicles\/\d+$/);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toMatch(/2019 Ambrel Loam/);
    await screenshot(page, "vehicles-saved-record");

    await page.getByRole("link", { name: "← Stock" }).click();
    await page.getByLabel("Search stock").fill("1G4AH59H45G118341");
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/q=1G4AH59H45G118341/);
    await expect.poll(() => page.locator("tbody tr").count()).toBe(1);
    expect(await page.locator("tbody").innerText()).toMatch(/Loam/);
    await screenshot(page, "vehicles-stock-table-search");
    expect(errors).toEqual([]);
    await page.close();
  });

  it("when a field is wrong, then the form says which, keeps every value typed, and nothing is saved", async () => {
    const page = await world.browser.newPage({ viewport: { width: 1366, height: 900 } });
    await signIn(page, "sales@demo.test");
    await page.goto(`${world.url}/app/vehicles/new`);
    await page.getByLabel("VIN").fill("1G4AH59HO5G118341");
    await page.getByLabel("Make").fill("Corvane");
    await page.getByLabel("Model", { exact: true }).fill("Pimlet");
    await page.getByLabel("Seats").fill("40");
    await page.getByRole("button", { name: "Add to stock" }).click();
    await expect.poll(() => page.getByText("2 fields need attention").count()).toBe(1);
    expect(await page.getByLabel("Make").inputValue()).toBe("Corvane");
    expect(await page.getByLabel("Seats").inputValue()).toBe("40");
    expect(page.url()).toMatch(/\/new$/);
    await screenshot(page, "vehicles-editor-errors");
    // A reload keeps the typing: the draft lives in the browser.
    await page.reload();
    await expect.poll(() => page.getByText("Unsaved changes restored").count()).toBe(1);
    expect(await page.getByLabel("Make").inputValue()).toBe("Corvane");
    await page.close();
  });
});

describe("the editor after the person's own status move (issue 12)", () => {
  it("when sales moves a vehicle's status and then edits and saves a field, then the save is accepted, not refused as a conflict with their own move", async () => {
    const sales = await world.t.signIn("sales");
    const created = await sales.post("/api/vehicles").send({ make: "Corvane", model: "Pimlet", buildYear: 2018, colour: "Moss green" });
    expect(created.status).toBe(201);
    const id = created.body.vehicle.id as number;

    const page = await world.browser.newPage({ viewport: { width: 1366, height: 900 } });
    await signIn(page, "sales@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}`);
    await expect.poll(() => page.getByLabel("Colour").inputValue()).toBe("Moss green");

    const status = page.getByRole("region", { name: "Status", exact: true });
    const moved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${id}/status`) && r.request().method() === "POST");
    await status.getByRole("button", { name: "Start preparing" }).click();
    expect((await moved).status()).toBe(200);
    await expect.poll(() => status.getByRole("button", { name: "Back to intake" }).count()).toBe(1);

    await page.getByLabel("Colour").fill("Harbour blue");
    const saved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${id}`) && r.request().method() === "PATCH");
    await page.getByRole("button", { name: "Save changes" }).click();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => page.getByText("All changes saved").count()).toBe(1);
    expect(await page.getByLabel("Colour").inputValue()).toBe("Harbour blue");
    expect(await page.getByText("Someone saved this vehicle after you opened it").count()).toBe(0);
    await page.close();
  });

  it("when someone else saves a field meanwhile, then the save is still refused as a conflict, and taking theirs keeps mine on top", async () => {
    const sales = await world.t.signIn("sales");
    const created = await sales.post("/api/vehicles").send({ make: "Drovell", model: "Fenwick", colour: "Chalk white" });
    const id = created.body.vehicle.id as number;

    const page = await world.browser.newPage({ viewport: { width: 1366, height: 900 } });
    await signIn(page, "sales@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}`);
    await expect.poll(() => page.getByLabel("Colour").inputValue()).toBe("Chalk white");

    const admin = await world.t.signIn("admin");
    expect((await admin.patch(`/api/vehicles/${id}`).send({ version: created.body.vehicle.version, colour: "Ember red" })).status).toBe(200);

    await page.getByLabel("Variant or trim").fill("1.6 estate");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => page.getByText("Someone saved this vehicle after you opened it").count()).toBe(1);
    await page.getByRole("button", { name: "Take their changes, keep mine on top" }).click();
    expect(await page.getByLabel("Colour").inputValue()).toBe("Ember red");
    expect(await page.getByLabel("Variant or trim").inputValue()).toBe("1.6 estate");
    const saved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${id}`) && r.request().method() === "PATCH");
    await page.getByRole("button", { name: "Save changes" }).click();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => page.getByText("All changes saved").count()).toBe(1);
    await page.close();
  });
});
