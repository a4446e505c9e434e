// The app ships its own font (Open Sans from @fontsource), only the subsets its pages use:
// Latin and Latin Extended, Greek for the trail's symbols, maths and symbols (app/app.css).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startHttpApp, type HttpApp } from "../support/http-app";

describe("the fonts a page loads", () => {
  let app: HttpApp;
  beforeAll(async () => {
    app = await startHttpApp();
  }, 240_000);
  afterAll(async () => app?.close());

  it("are served by the app itself, in the subsets the pages use and no others", async () => {
    const html = await (await fetch(`${app.baseUrl}/quick-sizing`)).text();
    const sheets = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
    expect(sheets.length).toBeGreaterThan(0);
    const css = (await Promise.all(sheets.map(async (href) => (await fetch(new URL(href, app.baseUrl))).text()))).join("\n");
    const faces = [...css.matchAll(/@font-face\s*{([^}]*)}/g)].map((m) => m[1]).filter((f) => /Open Sans/.test(f));
    const files = faces.map((f) => /url\(([^)]+\.woff2)\)/.exec(f)?.[1] ?? "");
    // 3 weights (400, 600, 700) × 5 subsets
    expect(faces).toHaveLength(15);
    for (const subset of ["latin", "latin-ext", "greek", "math", "symbols"]) expect(files.some((f) => f.includes(`open-sans-${subset}-`))).toBe(true);
    for (const unused of ["cyrillic", "hebrew", "vietnamese", "greek-ext"]) expect(files.some((f) => f.includes(`-${unused}-`))).toBe(false);
    // each file comes from our own origin, and is there
    for (const file of files) {
      const url = new URL(file, app.baseUrl);
      expect(url.origin).toBe(app.baseUrl);
      expect((await fetch(url)).status).toBe(200);
    }
  });
});
