/**
 * The Content-Security-Policy as a browser enforces it. Each page of the public site and the staff app is loaded in
 * Chromium (and the condition page printed) and every `securitypolicyviolation` event is collected: the policy, which
 * has no 'unsafe-inline' or 'unsafe-eval' anywhere, must refuse nothing the app itself does.
 */
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { e2eWorld } from "../support/e2e.ts";
import { publishReadyVehicle } from "../support/publishing.ts";

const world = e2eWorld();

type Violation = { page: string; directive: string; blocked: string; sample: string };

/** Collects every CSP violation the page reports, from the first script on. */
async function recordViolations(page: Page): Promise<Violation[]> {
  const found: Violation[] = [];
  await page.exposeFunction("__cspViolation", (v: Omit<Violation, "page">) => found.push({ page: page.url(), ...v }));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) =>
      (window as unknown as { __cspViolation: (v: unknown) => void }).__cspViolation({ directive: e.effectiveDirective, blocked: e.blockedURI, sample: e.sample }),
    );
  });
  return found;
}

async function visitAll(page: Page, paths: string[]) {
  for (const p of paths) {
    await page.goto(`${world.url}${p}`, { waitUntil: "networkidle" });
    await page.waitForTimeout(300);
  }
}

describe("Content-Security-Policy in the browser", () => {
  it("when the public pages and every staff page load and the report is printed, then the policy refuses nothing", async () => {
    const { t } = world;
    const { slug, vehicleId } = await publishReadyVehicle(t);
    const publicPaths = ["/", `/vehicles/${slug}`, `/vehicles/${slug}/card`, "/sign-in", "/forgot-password", "/vehicles/no-such-vehicle"];
    const staffPaths = [
      "/app", "/app/vehicles", "/app/vehicles/new", `/app/vehicles/${vehicleId}`, `/app/vehicles/${vehicleId}/photos`,
      `/app/vehicles/${vehicleId}/walkaround`, `/app/vehicles/${vehicleId}/checks`, "/app/leads", "/app/mail", "/app/feeds", "/app/users", "/app/settings",
    ];
    const context = await world.browser.newContext();
    const page = await context.newPage();
    const violations = await recordViolations(page);
    await visitAll(page, publicPaths);
    // The print footer (page address, revision, page numbers) is a constructed stylesheet, not an inline <style>.
    await page.goto(`${world.url}/vehicles/${slug}`, { waitUntil: "networkidle" });
    await page.emulateMedia({ media: "print" });
    const footer = await page.evaluate(() => document.adoptedStyleSheets.map((sheet) => [...sheet.cssRules].map((r) => r.cssText).join(" ")).join(" "));
    expect(footer).toMatch(/@page report/);
    expect(footer).toMatch(/revision \d+, published/);
    await page.pdf({ preferCSSPageSize: true });
    await page.emulateMedia({ media: "screen" });
    await world.signIn(page, "admin@demo.test");
    await visitAll(page, staffPaths);
    await context.close();
    // zod's eval probe is switched off in src/main.tsx (jitless), so even that no longer shows here.
    console.log(`csp: ${violations.length} violations over ${publicPaths.length + staffPaths.length} pages and one printed report`);
    expect(violations).toEqual([]);
  }, 240_000);
});
