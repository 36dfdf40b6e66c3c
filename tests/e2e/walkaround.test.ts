import { e2eWorld } from "../support/e2e.ts";
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { imagesSettled, screenshot, watchErrors } from "../support/browser.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { renderDemoPhoto } from "../../server/demo/art/index.ts";

const world = e2eWorld();

const signIn = (page: Page, email: string) => world.signIn(page, email);

describe("the workshop's walk-around on a phone", () => {
  it("when the workshop uploads photos and pins a defect, then progress shows, the photos turn ready, and the numbered pin matches the list", async () => {
    const sales = await world.t.signIn("sales");
    const v = (await sales.post("/api/vehicles").send(dieselSuv())).body.vehicle;
    const page = await world.browser.newPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 1 });
    const errors = watchErrors(page);
    await signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${v.id}/photos`);
    const files = await Promise.all(
      (["side_left", "front_left", "rear_right"] as const).map(async (angle, i) => ({
        name: `${angle}.jpg`,
        mimeType: "image/jpeg",
        buffer: await renderDemoPhoto({ bodyType: "suv", colour: "Slate grey", angle, seed: i }),
      })),
    );
    await page.getByTestId("photo-input").setInputFiles([...files, { name: "notes.txt.jpg", mimeType: "image/jpeg", buffer: Buffer.from("not a photo") }]);
    await expect.poll(() => page.locator('[data-state="done"]').count(), { timeout: 20_000 }).toBe(3);
    await expect.poll(() => page.locator('[data-state="refused"]').count()).toBe(1);
    expect(await page.locator('[data-state="refused"]').innerText()).toMatch(/not a photo Forthright can read/);
    await screenshot(page, "walkaround-phone-uploads");
    await expect.poll(() => page.getByText("Processing sizes…").count(), { timeout: 30_000 }).toBe(0);
    expect(await page.getByTestId("photo-card").count()).toBe(3);

    await page.getByRole("navigation", { name: "Vehicle sections" }).getByRole("link", { name: /Walk-around/ }).click();
    await page.getByRole("button", { name: /^Left side/ }).click();
    await page.getByRole("button", { name: "Place the pin" }).click();
    const photo = page.getByTestId("pinnable-photo");
    const box = (await photo.boundingBox())!;
    await photo.click({ position: { x: box.width * 0.3, y: box.height * 0.55 } });
    await page.getByLabel("Kind").selectOption("dent");
    await page.getByText("Moderate", { exact: true }).click();
    await page.getByLabel("Longest size").fill("22");
    await page.getByLabel("Note", { exact: true }).fill("Rear door, below the handle");
    await page.getByRole("button", { name: /Record a defect/ }).click();
    await expect.poll(() => page.getByText(/Defect 1 recorded and pinned/).count()).toBe(1);
    await expect.poll(() => page.getByRole("button", { name: /^Defect 1: moderate dent/ }).count()).toBe(1);
    expect(await page.getByRole("list", { name: "Defects in Left side" }).innerText()).toMatch(/Moderate dent, 22 mm/);
    await photo.scrollIntoViewIfNeeded();
    await imagesSettled(page);
    await page.screenshot({ path: "test-results/screenshots/walkaround-phone-pin-view.png" });
    await screenshot(page, "walkaround-phone-pinned");

    await page.getByRole("button", { name: /^Roof/ }).click();
    await page.getByRole("button", { name: "Nothing found here" }).click();
    await expect.poll(async () => page.getByRole("button", { name: /^Roof/ }).innerText()).toMatch(/Nothing found/);
    const zones = (await (await world.t.signIn("workshop")).get(`/api/vehicles/${v.id}/walkaround`)).body.zones;
    expect(zones.find((z: { zone: string }) => z.zone === "roof").state).toBe("nothing_found");
    expect(zones.find((z: { zone: string }) => z.zone === "left_side").state).toBe("defects");
    // The one refused file is answered 415 on purpose; Chromium logs that as a console error.
    expect(errors.filter((e) => !/status of 415/.test(e))).toEqual([]);
    await page.close();
  });
});
