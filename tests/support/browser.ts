import { chromium, type Browser, type Page } from "playwright-core";
import { execSync } from "node:child_process";
import { mkdirSync } from "node:fs";
import path from "node:path";

const chromiumPath = () => {
  for (const name of ["chromium", "chromium-browser"]) {
    try {
      return execSync(`command -v ${name}`, { encoding: "utf8" }).trim();
    } catch {
      /* try the next name */
    }
  }
  throw new Error("Debian's chromium is not installed (apt-get install -y chromium)");
};

/** Headless Debian Chromium with the flags this machine's closed network needs. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: chromiumPath(),
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
}

export const RESULTS_DIR = path.resolve("test-results/screenshots");

/** Waits (briefly) for every image on the page to finish, so screenshots show what a person would see. */
export async function imagesSettled(page: Page) {
  await page
    .waitForFunction(() => [...document.images].every((i) => i.loading === "lazy" || (i.complete && i.naturalWidth > 0)), undefined, { timeout: 5000 })
    .catch(() => undefined);
  // Loaded is not painted: wait for each visible image to be decoded too.
  await page.evaluate(() => Promise.all([...document.images].filter((i) => i.loading !== "lazy").map((i) => i.decode().catch(() => undefined)))).catch(() => undefined);
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(RESULTS_DIR, { recursive: true });
  await imagesSettled(page);
  await page.screenshot({ path: path.join(RESULTS_DIR, `${name}.png`), fullPage: true });
}

/** Collects errors a page throws, so a test can assert the page ran clean. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  return errors;
}
