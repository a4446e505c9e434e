// The production build served by the app's own server (app/serve.server.ts) against this test
// file's database: what browser tests drive and what the HTTP attack tests send requests to.
import { existsSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { ChildProcess } from "node:child_process";
import { inject } from "vitest";
import { freePort } from "../../db/cluster";
import { run, serveBuild, stop } from "../../fakes/processes";

let built: Promise<string> | undefined;
/**
 * One production build per test run, shared by every test file that serves the app: the first
 * file to get here builds while holding a lock folder, the others wait for its "done" mark.
 */
export function buildOnce() {
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

export interface HttpApp {
  baseUrl: string;
  /** What the server printed (request log, errors). */
  logs: string[];
  close(): Promise<void>;
}

/** Serves the shared build on a free port; `env` adds or overrides settings for this server. */
export async function startHttpApp(env: NodeJS.ProcessEnv = {}): Promise<HttpApp> {
  const buildDir = await buildOnce();
  const port = await freePort();
  const logs: string[] = [];
  const baseUrl = `http://127.0.0.1:${port}`;
  // APP_URL is this server's own address: links in mail and the payment page's way back lead here.
  // One process per test server (two cores run the whole suite); a test that wants workers says so.
  const server: ChildProcess = await serveBuild(
    port,
    { ...process.env, NODE_ENV: "production", APP_URL: baseUrl, WEB_CONCURRENCY: "1", ...env },
    (l) => logs.push(l),
    buildDir,
  );
  return {
    baseUrl,
    logs,
    async close() {
      await stop(server);
      if (process.env.DEBUG_BROWSER_APP) console.log(logs.join(""));
    },
  };
}

/** A served app and one whose object store never answers (nothing listens on a port just found free). */
export async function startAppAndStoreDown(): Promise<{ app: HttpApp; storeDown: HttpApp }> {
  const nowhere = `http://127.0.0.1:${await freePort()}`;
  // One after the other: two servers booting at once on a loaded machine may miss the start-up wait.
  const app = await startHttpApp();
  return { app, storeDown: await startHttpApp({ S3_ENDPOINT: nowhere }) };
}

/** A request to a served app as a signed-in browser sends it: its session cookie, the app's own origin, no redirects followed. */
export function sendAs(server: HttpApp, cookie: string, path: string, init: RequestInit = {}) {
  const headers = new Headers(init.headers);
  headers.set("Cookie", cookie);
  headers.set("Origin", server.baseUrl);
  return fetch(`${server.baseUrl}${path}`, { ...init, headers, redirect: "manual" });
}
