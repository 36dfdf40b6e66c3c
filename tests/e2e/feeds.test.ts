import { describe, expect, it } from "vitest";
import request from "supertest";
import { parse as parseCsv } from "csv-parse/sync";
import { e2eWorld } from "../support/e2e.ts";
import { screenshot, watchErrors } from "../support/browser.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { DEMO_USERS } from "../../server/demo/demo.ts";

const world = e2eWorld();
const marketing = DEMO_USERS.find((u) => u.role === "marketing")!.email;

describe("marketing's feeds screen in Chromium", () => {
  it("when marketing creates a feed, then it previews the first rows, saves it, sees the secret URL once, and the portal's fetch shows in the log", async () => {
    await publishReadyVehicle(world.t, { model: 'Loam, "Crest" Ωmega 🚙', variant: "" });
    const page = await world.browser.newPage({ viewport: { width: 1280, height: 900 }, deviceScaleFactor: 1 });
    const errors = watchErrors(page);
    await world.signIn(page, marketing);
    await page.getByRole("navigation", { name: "Staff" }).getByRole("link", { name: "Feeds", exact: true }).click();
    await page.getByRole("heading", { name: "Feeds", level: 1 }).waitFor();
    await page.getByText("No feeds yet").waitFor();

    const form = page.getByRole("form", { name: "Create a feed" });
    await form.getByLabel("Name").fill("Tallowbridge Motors portal");
    // Column picker: rename the model's header, move the price to the top, drop the photos, add days in stock.
    await form.getByLabel("Header for Model").fill("Model name");
    for (let i = 0; i < 11; i++) await form.getByRole("button", { name: "Move Price up" }).click();
    await form.getByRole("button", { name: "Remove All photo URLs" }).click();
    await form.getByLabel("Add a column").selectOption("daysInStock");
    await form.getByRole("button", { name: "Add", exact: true }).click();

    await form.getByRole("button", { name: "Preview the first rows" }).click();
    const table = page.getByRole("table", { name: "Preview of the first rows" });
    await table.waitFor();
    expect(await table.locator("th").first().textContent()).toBe("price");
    await expect.poll(() => table.locator("th", { hasText: "Model name" }).count()).toBe(1);
    expect(await table.textContent()).toContain("Ωmega 🚙");
    await screenshot(page, "feeds-preview");

    await form.getByRole("button", { name: "Save the feed" }).click();
    await page.getByText("Save this URL now: it will not be shown again").waitFor();
    const url = (await page.getByTestId("secret-url").textContent())!.trim();
    expect(url).toMatch(/\/feeds\/[A-Za-z0-9_-]{43}\.csv$/);
    await screenshot(page, "feeds-secret-url");
    await page.getByRole("button", { name: "I have saved it" }).click();
    expect(await page.getByTestId("secret-url").count()).toBe(0);
    expect(await page.content()).not.toContain(new URL(url).pathname);

    // A portal fetches the feed.
    const res = await request(world.url).get(new URL(url).pathname).set("User-Agent", "TallowbridgePortal/1.0");
    expect(res.status).toBe(200);
    const rows = parseCsv<Record<string, string>>(res.text, { columns: true });
    expect(rows.some((r) => r["Model name"] === 'Loam, "Crest" Ωmega 🚙')).toBe(true);

    // The fetch is logged once its answer has gone (feeds.public.routes.ts), so the page may need a reload or two.
    const card = page.getByRole("article", { name: "Feed Tallowbridge Motors portal" });
    await expect
      .poll(async () => {
        await page.reload();
        await card.waitFor();
        return card.getByText("Last fetched just now.").count();
      })
      .toBe(1);
    const log = card.getByRole("table", { name: "Fetches of Tallowbridge Motors portal" });
    expect(await log.textContent()).toContain("TallowbridgePortal/1.0");
    await screenshot(page, "feeds-list-fetched");

    // Rotating asks first; the old URL then answers 404.
    await card.getByRole("button", { name: "Rotate URL" }).click();
    await card.getByRole("button", { name: "Yes, rotate" }).click();
    await page.getByText("Save this URL now: it will not be shown again").waitFor();
    expect((await request(world.url).get(new URL(url).pathname)).status).toBe(404);
    expect(errors).toEqual([]);
    await page.close();
  }, 90_000);
});
