import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { startTestApp, type TestApp } from "../support/app.ts";
import { launchBrowser } from "../support/browser.ts";
import { listen } from "../support/http-server.ts";
import { publishReadyVehicle } from "../support/publishing.ts";

let t: TestApp;
let browser: Browser;
let server: Awaited<ReturnType<typeof listen>>;
beforeAll(async () => {
  t = await startTestApp();
  server = await listen(t.app);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
  await t?.close();
});

// Hostile listing copy (common XSS payload shapes; common practice, no source). Each would set window.__pwned.
const PAYLOADS = [
  "<script>window.__pwned = 1</script>",
  "<img src=x onerror=\"window.__pwned = 2\">",
  "[click me](javascript:window.__pwned=3)",
  "<a href=\"javascript:window.__pwned=4\">x</a>",
  "<svg onload=\"window.__pwned=5\"></svg>",
  "<iframe srcdoc=\"<script>parent.__pwned=6</script>\"></iframe>",
  "<details open ontoggle=\"window.__pwned=7\">x</details>",
  "![x](x\" onerror=\"window.__pwned=8)",
  "<style>body{background:url(javascript:window.__pwned=9)}</style>",
];

describe("listing copy on the public page", () => {
  it("when the copy is full of script payloads, then the condition page renders it as inert text in Chromium and nothing runs", async () => {
    const description = `A tidy wagon.\n\n${PAYLOADS.join("\n\n")}\n\n**Bold still works.**`;
    const { slug } = await publishReadyVehicle(t, { description });
    const page = await browser.newPage();
    const dialogs: string[] = [];
    page.on("dialog", (d) => (dialogs.push(d.message()), d.dismiss()));
    await page.goto(`${server.url}/vehicles/${slug}`, { waitUntil: "networkidle" });
    await page.waitForSelector(".prose-copy strong");
    // Click every link in the copy: none may run script.
    for (const link of await page.locator(".prose-copy a").all()) await link.click({ trial: false }).catch(() => undefined);
    await page.waitForTimeout(300);
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(dialogs).toEqual([]);
    expect(await page.locator(".prose-copy script, .prose-copy img, .prose-copy iframe, .prose-copy svg, .prose-copy [onerror], .prose-copy [onload]").count()).toBe(0);
    expect(await page.locator(".prose-copy strong").innerText()).toBe("Bold still works.");
    await page.close();
  });
});
