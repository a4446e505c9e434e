// Real browser tests: the production build served against this file's database, driven by
// playwright-core in Debian's chromium (installed by the test setup; never a browser download).
import { existsSync, mkdirSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll } from "vitest";
import { chromium, type Browser, type Page } from "playwright-core";
import { PASSWORD } from "./factories";
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

/**
 * This test file's browser on the app, `start`ed before its tests (after the file's own
 * `beforeAll` hooks written above the call, so data made there is in place) and closed after
 * them. Until then every use of it throws.
 */
export function browserAppForFile<App extends BrowserApp = BrowserApp>(
  start: () => Promise<App> = startBrowserApp as () => Promise<App>,
  timeout = 180_000,
): App {
  let started: App | undefined;
  beforeAll(async () => {
    started = await start();
  }, timeout);
  afterAll(async () => {
    await started?.close();
  });
  return new Proxy({} as App, {
    get(_, key) {
      if (!started) throw new Error("The browser app starts in beforeAll: use it inside a test");
      return Reflect.get(started, key);
    },
  });
}

/** A phone's viewport (an iPhone 12–14's CSS pixels), where no page may scroll sideways. */
export const PHONE = { width: 390, height: 844 };

/**
 * A new page signed in through the form as `email` (the factories' PASSWORD unless given), once
 * the browser has landed on `home` (a URL glob or test: the role's first page). `viewport` is set first.
 */
export async function signedInPage(
  app: BrowserApp,
  email: string,
  home: Parameters<Page["waitForURL"]>[0],
  options: { password?: string; viewport?: { width: number; height: number } } = {},
) {
  const page = await app.newPage();
  if (options.viewport) await page.setViewportSize(options.viewport);
  await signInAs(page, email, options.password ?? PASSWORD);
  await page.waitForURL(home);
  return page;
}

/** Opens `url` and waits until React has hydrated it, so the test's first click reaches the app. */
export async function openHydrated(page: Page, url: string) {
  await page.goto(url);
  await hydrated(page);
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
