import { describe, expect, it } from "vitest";
import { e2eWorld } from "../support/e2e.ts";
import type { Page } from "playwright-core";
import { screenshot, watchErrors } from "../support/browser.ts";
import { dieselSuv } from "../support/vehicles.ts";

const world = e2eWorld();

const signIn = (page: Page, email: string) => world.signIn(page, email);

/** Sales puts the vehicle into stock through the API, as in tests/api/walkaround.test.ts. */
async function stockedVehicle(): Promise<number> {
  const sales = await world.t.signIn("sales");
  const res = await sales.post("/api/vehicles").send(dieselSuv());
  expect(res.status).toBe(201);
  return res.body.vehicle.id as number;
}

// A phone held in one hand on the yard (390 × 844 CSS px, common practice, no source).
const PHONE = { width: 390, height: 844 };

const tyre = (page: Page, name: string) => page.getByRole("region", { name, exact: true });
const checkRow = (page: Page, name: RegExp) => page.getByRole("group", { name });

async function fillTyre(page: Page, name: string, r: { inner: string; centre: string; outer: string; size?: string; dot: string; kpa: string }) {
  const card = tyre(page, name);
  await card.getByLabel(`${name} inner tread`).fill(r.inner);
  await card.getByLabel(`${name} centre tread`).fill(r.centre);
  await card.getByLabel(`${name} outer tread`).fill(r.outer);
  if (r.size) await card.getByLabel(`${name} size`).fill(r.size);
  else await card.getByRole("button", { name: "Same as front left" }).click();
  await card.getByLabel(`${name} DOT date code`).fill(r.dot);
  await card.getByLabel(`${name} pressure`).fill(r.kpa);
}

describe("tyres and checks on a phone in Chromium", () => {
  it("when the workshop records four tyres and fails the brakes, then the live figures and the blocking cautions show, and a reload keeps every value", async () => {
    const id = await stockedVehicle();
    const page = await world.browser.newPage({ viewport: PHONE, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
    page.setDefaultTimeout(8_000); // a missing element fails with its name, inside the test's 30 s
    const errors = watchErrors(page);
    await signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}/checks`);
    await expect.poll(() => page.getByRole("heading", { name: "Tyres", exact: true }).count()).toBe(1);
    expect(await page.getByText("Nothing recorded here calls for a caution.").count()).toBe(1);

    await page.getByLabel("Measured on").fill("2025-06-20");
    await fillTyre(page, "Front left", { inner: "5.1", centre: "5.4", outer: "4.9", size: "235/60 R18 103V", dot: "2319", kpa: "240" });
    const fl = await tyre(page, "Front left").innerText();
    // AU minimum 1.5 mm: WA Road Traffic (Vehicles) Regulations 2014 r 270(2), ../shared/TRADE.md §2.5 (S [S9]); 4.9 mm ≥ 1.5 mm passes.
    expect(fl).toMatch(/Least 4\.9\s?mm\s\(outer\) — above the 1\.5\s?mm minimum/);
    // (4.9 − 1.5) ÷ (8 − 1.5) × 100 = 52.3 → 52 %: the project's own formula, the demo's new-tyre depth of 8 mm (common practice, no source).
    expect(fl).toMatch(/52\s?%/);
    // 235/60 R18: overall diameter 18 × 25.4 + 2 × 235 × 0.60 = 739.2 mm (../shared/TRADE.md §2.1, S2 [S16]).
    expect(fl).toMatch(/235\s?mm wide · 60\s?% profile · 18\s?in rim · radial/);
    expect(fl).toMatch(/Overall diameter 739\.2\s?mm/);
    // Load index 103 → 875 kg (../shared/TRADE.md §2.2, S2 [S16]); speed symbol V → 240 km/h (§2.3, S2 [S16]).
    expect(fl).toMatch(/Load 103 → 875\s?kg per tyre/);
    expect(fl).toMatch(/Speed V → up to 240\s?km\/h/);
    // DOT 2319 measured 2025-06-20 → 6 years (../shared/TRADE.md §2.4, S [S5]); 6 years → advise (§2.6, CP).
    expect(fl).toMatch(/Advise: 6 years old/);
    expect(fl).not.toMatch(/unsafe/i);

    await fillTyre(page, "Front right", { inner: "5.0", centre: "5.2", outer: "5.0", dot: "2319", kpa: "240" });
    expect(await tyre(page, "Front right").getByLabel("Front right size").inputValue()).toBe("235/60 R18 103V");
    const rearLeft = tyre(page, "Rear left");
    expect(await rearLeft.getByText("Below the legal minimum").count()).toBe(0);
    await fillTyre(page, "Rear left", { inner: "1.4", centre: "1.6", outer: "1.7", dot: "0414", kpa: "230" });
    // 1.4 mm < 1.5 mm (WA Road Traffic (Vehicles) Regulations 2014 r 270(2), ../shared/TRADE.md §2.5, S [S9]): shown live, before saving.
    await expect.poll(() => rearLeft.getByText("Below the legal minimum").count()).toBe(1);
    // DOT 0414 → week 4 of 2014; at 2025-06-20 that is 11 whole years (§2.4, S [S5]) → strong advisory at ≥ 10 years (§2.6, CP).
    expect(await rearLeft.innerText()).toMatch(/Strong advisory: 11 years old/);
    await fillTyre(page, "Rear right", { inner: "3.0", centre: "3.2", outer: "3.1", dot: "2319", kpa: "240" });
    // The spare stays "No spare / not measured" and is not sent.
    expect(await tyre(page, "Spare").innerText()).toMatch(/No spare \/ not measured/);

    const brakes = checkRow(page, /^Brakes/);
    expect(await brakes.innerText()).toMatch(/Safety item/i);
    await brakes.getByRole("radio", { name: "Fail" }).check();
    expect(await brakes.innerText()).toMatch(/say what you found and what to do/i);
    await brakes.getByLabel("Brakes: what you found and what to do").fill("Rear pads worn to the backing plate; replace pads and discs before sale");
    await checkRow(page, /^Lights/).getByRole("radio", { name: "Pass" }).check();
    await checkRow(page, /^Heating and air conditioning/).getByRole("radio", { name: "Advise" }).check();
    await checkRow(page, /^Heating and air conditioning/).getByLabel(/what you found/i).fill("Slow to cool; regas before sale");

    // While editing, the cautions the typed values will bring are shown and marked as not saved.
    const cautions = page.getByRole("region", { name: "Cautions" });
    // Six: the failed brakes, the rear left below the minimum, and the four tyres aged 6 years or more.
    await expect.poll(() => cautions.getByText("Not saved yet").count()).toBe(6);
    expect(await page.getByTestId("not-a-certificate").innerText()).toMatch(/not a roadworthiness or safety certificate/);
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, "checks-phone-filled");

    const save = page.getByRole("button", { name: "Save tyres and checks" });
    // The save button sticks to the bottom of the screen, in thumb reach, wherever the person has scrolled to.
    await tyre(page, "Front right").scrollIntoViewIfNeeded();
    const box = (await save.boundingBox())!;
    expect(box.y + box.height).toBeLessThanOrEqual(PHONE.height);
    expect(box.y).toBeGreaterThan(PHONE.height - 120);
    expect(box.height).toBeGreaterThanOrEqual(44);
    await save.click();
    await expect.poll(() => page.getByTestId("save-status").innerText()).toBe("Saved the tyre readings and the checks.");
    const saved = await cautions.innerText();
    expect(saved).toMatch(/must be repaired before sale for road use/);
    expect(saved).toMatch(/Publishing is blocked until then/);
    expect(saved).toMatch(/Brakes failed\. The vehicle must be repaired before it is sold for road use/);
    expect(saved).toMatch(/Rear left tyre: 1\.4\s?mm at its shallowest, below the legal minimum/);
    // Several advisories fold under one line that says what to do; opened, they name each tyre.
    await cautions.getByText(/4 advisories: tell the buyer/).click();
    expect(await cautions.innerText()).toMatch(/Rear left tyre is 11 years old/);
    expect(saved).not.toMatch(/Not saved yet/);
    expect(await page.getByRole("button", { name: "Saved" }).isDisabled()).toBe(true);
    // The layout re-reads the vehicle, so its condition index now has a figure.
    await expect.poll(() => page.getByTestId("condition-index").first().innerText()).toMatch(/^\d+/);
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, "checks-phone-saved");

    const stored = (await (await world.t.signIn("sales")).get(`/api/vehicles/${id}/checks`)).body;
    expect(stored.tyres.readings.map((r: { reading: { position: string } }) => r.reading.position)).toEqual(["front_left", "front_right", "rear_left", "rear_right"]);
    expect(stored.tyres.measuredOn).toBe("2025-06-20");
    expect(stored.checks.results.map((r: { item: string; result: string }) => `${r.item}:${r.result}`).sort()).toEqual(["brakes:fail", "climate:advise", "lights:pass"]);

    await page.reload();
    await expect.poll(() => tyre(page, "Rear left").getByLabel("Rear left inner tread").inputValue()).toBe("1.4");
    expect(await page.getByLabel("Measured on").inputValue()).toBe("2025-06-20");
    expect(await tyre(page, "Front left").getByLabel("Front left outer tread").inputValue()).toBe("4.9");
    // Stored as the number 5; read back to 1 dp as typed (../shared/TRADE.md §2.5: tread in mm to 1 dp).
    expect(await tyre(page, "Front right").getByLabel("Front right inner tread").inputValue()).toBe("5.0");
    expect(await tyre(page, "Rear left").getByLabel("Rear left DOT date code").inputValue()).toBe("0414");
    expect(await tyre(page, "Rear right").getByLabel("Rear right size").inputValue()).toBe("235/60 R18 103V");
    expect(await tyre(page, "Front right").getByLabel("Front right pressure").inputValue()).toBe("240");
    expect(await checkRow(page, /^Brakes/).getByRole("radio", { name: "Fail" }).isChecked()).toBe(true);
    expect(await checkRow(page, /^Brakes/).getByLabel(/what you found/i).inputValue()).toMatch(/backing plate/);
    expect(await checkRow(page, /^Windows/).getByRole("radio", { name: "Pass" }).isChecked()).toBe(false);
    expect(await tyre(page, "Rear left").getByText("Below the legal minimum").count()).toBe(1);
    expect(await cautions.innerText()).toMatch(/Brakes failed/);
    expect(errors).toEqual([]);
    await page.close();
  });

  it("when someone else saves first, then the form says so, keeps what was typed, and loads theirs only when asked", async () => {
    const id = await stockedVehicle();
    const page = await world.browser.newPage({ viewport: PHONE, isMobile: true, hasTouch: true });
    await signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}/checks`);
    await tyre(page, "Front left").getByLabel("Front left inner tread").fill("6.2");
    // Another workshop phone saves the same vehicle's tyres meanwhile.
    const other = await world.t.signIn("workshop");
    const theirs = await other.put(`/api/vehicles/${id}/tyres`).send({ version: 0, measuredOn: "2025-06-20", readings: [{ position: "front_left", treadInnerMm: 7.0 }] });
    expect(theirs.status).toBe(200);
    await page.getByRole("button", { name: "Save tyres" }).click();
    await expect.poll(() => page.getByText("Someone saved these readings after you opened them").count()).toBe(1);
    expect(await tyre(page, "Front left").getByLabel("Front left inner tread").inputValue()).toBe("6.2");
    await page.getByRole("button", { name: "Load theirs" }).click();
    await expect.poll(() => tyre(page, "Front left").getByLabel("Front left inner tread").inputValue()).toBe("7.0");
    expect(await page.getByText("Someone saved these readings after you opened them").count()).toBe(0);
    await page.close();
  });

  it("when a reading is wrong, then the field says why before anything is sent", async () => {
    const id = await stockedVehicle();
    const page = await world.browser.newPage({ viewport: PHONE, isMobile: true, hasTouch: true });
    await signIn(page, "workshop@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}/checks`);
    const card = tyre(page, "Front left");
    await card.getByLabel("Front left inner tread").fill("4.95");
    await card.getByLabel("Front left centre tread").fill("40");
    await page.getByRole("button", { name: "Save tyres" }).click();
    await expect.poll(() => card.getByText("Inner tread to 1 decimal place, like 4.9.").count()).toBe(1);
    // The shared schema's own limit (shared/schemas/evidence.ts: at most 30 mm).
    expect(await card.getByText("Centre tread is at most 30 mm.").count()).toBe(1);
    expect(await card.getByLabel("Front left inner tread").inputValue()).toBe("4.95");
    expect((await (await world.t.signIn("workshop")).get(`/api/vehicles/${id}/checks`)).body.tyres.version).toBe(0);
    await page.close();
  });

  it("when marketing opens the screen, then everything reads but nothing can be changed or saved", async () => {
    const id = await stockedVehicle();
    const page = await world.browser.newPage({ viewport: PHONE, isMobile: true, hasTouch: true });
    await signIn(page, "marketing@demo.test");
    await page.goto(`${world.url}/app/vehicles/${id}/checks`);
    await expect.poll(() => page.getByText("Your role can read the tyres and checks").count()).toBe(1);
    expect(await tyre(page, "Front left").getByLabel("Front left inner tread").isDisabled()).toBe(true);
    expect(await checkRow(page, /^Brakes/).getByRole("radio", { name: "Fail" }).isDisabled()).toBe(true);
    expect(await page.getByRole("button", { name: /^Save/ }).count()).toBe(0);
    await page.close();
  });
});
