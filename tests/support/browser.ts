// Real browser tests: the production build served against this file's database, driven by
// playwright-core in Debian's chromium (installed here when missing; never a browser download).
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { ChildProcess } from "node:child_process";
import { chromium, type Browser, type Page } from "playwright-core";
import { inject } from "vitest";
import { freePort } from "../../db/cluster";
import { run, serveBuild, stop } from "../../fakes/processes";

const CHROMIUM = "/usr/bin/chromium";
export const SCREENSHOTS = path.resolve("tests/browser/screenshots");

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error("Browser tests need Debian's chromium: sudo apt-get install -y chromium");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env });
}

let built: Promise<string> | undefined;
/**
 * One production build per test run, shared by every browser test file: the first file to get
 * here builds while holding a lock folder, the others wait for its "done" mark.
 */
function buildOnce() {
  built ??= (async () => {
    const dir = inject("buildDir");
    const done = path.join(dir, ".done");
    const lock = `${dir}.lock`;
    mkdirSync(path.dirname(lock), { recursive: true });
    for (;;) {
      if (existsSync(done)) return dir;
      try {
        mkdirSync(lock);
      } catch (error) {
        // Only "someone else holds it" means wait; anything else is a real failure.
        if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
        await new Promise((r) => setTimeout(r, 250));
        continue;
      }
      try {
        // A production build, as users get it: Vitest's NODE_ENV=test would bundle React's development build.
        if (!existsSync(done)) {
          await run("node_modules/.bin/react-router", ["build"], { ...process.env, NODE_ENV: "production", TENDERFLOW_BUILD_DIR: dir }, true);
          writeFileSync(done, "");
        }
      } finally {
        rmSync(lock, { recursive: true, force: true });
      }
    }
  })();
  return built;
}

export interface BrowserApp {
  baseUrl: string;
  browser: Browser;
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

export async function startBrowserApp(): Promise<BrowserApp> {
  ensureChromium();
  const buildDir = await buildOnce();
  const port = await freePort();
  const logs: string[] = [];
  // APP_URL is this server's own address: links in mail and the payment page's way back lead here.
  const server: ChildProcess = await serveBuild(port, { ...process.env, NODE_ENV: "production", APP_URL: `http://127.0.0.1:${port}` }, (l) => logs.push(l), buildDir);
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
  });
  mkdirSync(SCREENSHOTS, { recursive: true });
  const baseUrl = `http://127.0.0.1:${port}`;
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
      await stop(server);
      if (process.env.DEBUG_BROWSER_APP) console.log(logs.join(""));
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
