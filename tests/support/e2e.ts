import { afterAll, beforeAll } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DEMO_PASSWORD, startTestApp, type TestApp } from "./app.ts";
import { launchBrowser } from "./browser.ts";
import { listen } from "./http-server.ts";

/**
 * One browser test file's world: the app on its own database, listening on a free port, and headless Chromium.
 * Call at the top of the file; read the parts inside tests (they exist once beforeAll has run).
 */
export function e2eWorld(options: Parameters<typeof startTestApp>[0] = {}) {
  let t: TestApp;
  let browser: Browser;
  let server: Awaited<ReturnType<typeof listen>>;
  beforeAll(async () => {
    t = await startTestApp(options);
    server = await listen(t.app);
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
    await t?.close();
  });
  return {
    get t() {
      return t;
    },
    get url() {
      return server.url;
    },
    get browser() {
      return browser;
    },
    /** Signs a staff member in through the sign-in page, as a person would. */
    async signIn(page: Page, email: string) {
      await page.goto(`${server.url}/sign-in`);
      await page.getByLabel("E-mail").fill(email);
      await page.getByLabel("Password").fill(DEMO_PASSWORD);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL(`${server.url}/app`);
    },
  };
}
