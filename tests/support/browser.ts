// Real browser tests: the production build served against this file's database, driven by
// playwright-core in Debian's chromium (installed by the test setup; never a browser download).
import { existsSync, mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";
import { startHttpApp } from "./http-app";

const CHROMIUM = "/usr/bin/chromium";
export const SCREENSHOTS = path.resolve("tests/browser/screenshots");

export interface BrowserApp {
  baseUrl: string;
  browser: Browser;
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

/** A browser on the app: one test server, or the front door of several (`startServerPair`). */
export async function startBrowserApp(server?: { baseUrl: string; close(): Promise<void> }): Promise<BrowserApp> {
  // Chromium itself is installed by the test setup (tests/setup/global-setup.ts).
  if (!existsSync(CHROMIUM)) throw new Error(`Browser tests need Debian's chromium at ${CHROMIUM}: sudo apt-get install -y chromium`);
  server ??= await startHttpApp();
  const { baseUrl } = server;
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
      "--disable-quic",
    ],
  });
  mkdirSync(SCREENSHOTS, { recursive: true });
  return {
    baseUrl,
    browser,
    async newPage() {
      const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 860 } });
      const page = await context.newPage();
      // Any request that leaves the machine is a bug (fonts and scripts ship with the app).
      await page.route(/^(?!http:\/\/127\.0\.0\.1)/, (route) => route.abort());
      return page;
    },
    async close() {
      await browser.close();
      await server.close();
    },
  };
}

/** Waits until React has hydrated, so typing and clicking reach the app's handlers. */
export async function hydrated(page: Page) {
  await page.waitForFunction(() => (window as unknown as { __reactRouterRouteModules?: unknown }).__reactRouterRouteModules !== undefined);
}

export async function signInAs(page: Page, email: string, password: string) {
  await page.goto("/sign-in");
  await hydrated(page);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}
