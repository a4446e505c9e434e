// The production server serves from one worker per core (app/serve.server.ts): the workers share
// the port, every one of them answers, and one signal stops them all.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startHttpApp, type HttpApp } from "../support/http-app";

describe("the server with two workers", () => {
  let app: HttpApp;
  beforeAll(async () => {
    app = await startHttpApp({ WEB_CONCURRENCY: "2" });
  }, 240_000);
  afterAll(async () => app?.close());

  it("says how many workers listen, and answers many requests at once", async () => {
    await expect.poll(() => app.logs.join("")).toMatch(/listening on http:\/\/127\.0\.0\.1:\d+ \(2 workers\)/);
    const answers = await Promise.all(Array.from({ length: 40 }, () => fetch(`${app.baseUrl}/api/v1/health`)));
    expect(answers.map((r) => r.status)).toEqual(Array(40).fill(200));
    // The page a visitor opens first is served too, by whichever worker takes it.
    const page = await fetch(`${app.baseUrl}/quick-sizing`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("<html");
  });

  it("stops every worker on one SIGTERM: the port no longer answers", async () => {
    await app.close();
    await expect(fetch(`${app.baseUrl}/api/v1/health`)).rejects.toThrow();
  });
});
