import { e2eWorld } from "../support/e2e.ts";
import { describe, expect, it } from "vitest";
import { publishReadyVehicle } from "../support/publishing.ts";

const world = e2eWorld();

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
    const { slug } = await publishReadyVehicle(world.t, { description });
    const page = await world.browser.newPage();
    const dialogs: string[] = [];
    page.on("dialog", (d) => (dialogs.push(d.message()), d.dismiss()));
    await page.goto(`${world.url}/vehicles/${slug}`, { waitUntil: "networkidle" });
    await page.locator(".prose-copy strong", { hasText: "Bold still works." }).waitFor();
    // Click every link in the copy: none may run script.
    for (const link of await page.locator(".prose-copy a").all()) await link.click({ trial: false }).catch(() => undefined);
    await page.waitForTimeout(300);
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(dialogs).toEqual([]);
    expect(await page.locator(".prose-copy script, .prose-copy img, .prose-copy iframe, .prose-copy svg, .prose-copy [onerror], .prose-copy [onload]").count()).toBe(0);
    expect(await page.locator(".prose-copy strong", { hasText: "Bold still works." }).count()).toBe(1);
    await page.close();
  });
});
