import { describe, expect, it } from "vitest";
import type { Page, Request } from "playwright-core";
import { e2eWorld } from "../support/e2e.ts";
import { screenshot, watchErrors } from "../support/browser.ts";
import { prepareReadyVehicle } from "../support/publishing.ts";
import { renderDemoPhoto } from "../../server/demo/art/index.ts";

const world = e2eWorld();

const readiness = (page: Page) => page.getByRole("region", { name: "Publishing" }).getByRole("list", { name: "Readiness" });

/** The API reads the page makes, as "GET /api/vehicles/:id…" paths, from now on. */
function readsOf(page: Page) {
  const seen: string[] = [];
  page.on("request", (r: Request) => {
    const url = new URL(r.url());
    if (r.method() === "GET" && url.pathname.startsWith("/api/vehicles/")) seen.push(url.pathname);
  });
  return seen;
}

describe("a vehicle's photos and its readiness", () => {
  it("when a new photo's sizes are made, then the publishing panel's 'Photos processed' turns done by itself, with no reload", async () => {
    const { vehicleId: id } = await prepareReadyVehicle(world.t);
    const page = await world.browser.newPage({ viewport: { width: 1440, height: 1000 }, deviceScaleFactor: 1 });
    const errors = watchErrors(page);
    await world.signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}`);
    await expect.poll(() => page.getByTestId("condition-index").innerText()).toMatch(/\d/);
    await expect.poll(() => readiness(page).innerText()).toMatch(/Done:\s+Photos processed/);
    await screenshot(page, "vehicle-record");

    await page.getByRole("navigation", { name: "Vehicle sections" }).getByRole("link", { name: /Photos/ }).click();
    const before = 4; // prepareReadyVehicle's photos
    await expect.poll(() => page.getByTestId("photo-card").count()).toBe(before);
    const photo = await renderDemoPhoto({ bodyType: "suv", colour: "Slate grey", angle: "rear", seed: 7 });
    await page.getByTestId("photo-input").setInputFiles([{ name: "rear.jpg", mimeType: "image/jpeg", buffer: photo }]);
    await expect.poll(() => readiness(page).innerText(), { timeout: 20_000 }).toMatch(/Missing:\s+Photos processed/);
    await expect.poll(() => page.getByTestId("photo-card").count()).toBe(before + 1);
    await expect.poll(() => page.getByText("Processing sizes…").count(), { timeout: 30_000 }).toBe(0);
    await expect.poll(() => readiness(page).innerText(), { timeout: 10_000 }).toMatch(/Done:\s+Photos processed/);
    expect(await page.getByRole("navigation", { name: "Vehicle sections" }).getByRole("link", { name: /Photos/ }).innerText()).toContain(`(${before + 1})`);
    await screenshot(page, "vehicle-photos");
    expect(errors).toEqual([]);
  });

  it("when a tyre reading is saved, then the evidence and readiness are read again but not the record", async () => {
    const { vehicleId: id } = await prepareReadyVehicle(world.t);
    const page = await world.browser.newPage({ viewport: { width: 1440, height: 1000 }, deviceScaleFactor: 1 });
    const errors = watchErrors(page);
    await world.signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}/checks`);
    await expect.poll(() => page.getByTestId("condition-index").innerText()).toMatch(/\d/);
    const reads = readsOf(page);
    await page.getByRole("region", { name: "Front left", exact: true }).getByLabel("Front left centre tread").fill("5.5");
    const saved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${id}/tyres`) && r.request().method() === "PUT");
    await page.getByRole("button", { name: /^Save tyre/ }).click();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => reads.slice().sort()).toEqual([`/api/vehicles/${id}`, `/api/vehicles/${id}/evidence`]);
    expect(errors).toEqual([]);
  });
});
